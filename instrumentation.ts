/** Runs once per server process, before it handles requests (Next's instrumentation hook). */
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { serverEnv } = await import("@/lib/env");
  const { installClientAddressHook } = await import("@/lib/auth/client-address-hook");
  installClientAddressHook(serverEnv().TRUSTED_PROXY_COUNT);
}
