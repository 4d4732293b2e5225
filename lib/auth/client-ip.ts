/** The address a request came from, as the proxy in front reports it; "unknown" when nothing says. */
export const UNKNOWN_IP = "unknown";

export function clientIp(headers: unknown): string {
  const get = (name: string): string | undefined => {
    if (headers && typeof (headers as Headers).get === "function") return (headers as Headers).get(name) ?? undefined;
    const value = (headers as Record<string, string | string[] | undefined> | undefined)?.[name];
    return Array.isArray(value) ? value[0] : value;
  };
  return get("x-forwarded-for")?.split(",")[0]?.trim() || get("x-real-ip") || UNKNOWN_IP;
}
