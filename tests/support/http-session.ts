/** Sign in over HTTP the way a browser does (CSRF token, then the credentials callback) and keep the cookies. */
export class HttpSession {
  private cookies = new Map<string, string>();

  constructor(readonly base: string) {}

  private remember(res: Response): void {
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(";");
      const eq = pair.indexOf("=");
      this.cookies.set(pair.slice(0, eq), pair.slice(eq + 1));
    }
  }

  get cookieHeader(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join("; ");
  }

  /** Like a browser: unsafe methods carry this page's Origin unless the caller sets (or removes) it. */
  async fetch(path: string, init: RequestInit = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    if (this.cookies.size) headers.set("cookie", this.cookieHeader);
    const unsafe = !["GET", "HEAD", "OPTIONS"].includes((init.method ?? "GET").toUpperCase());
    if (unsafe && !headers.has("origin")) headers.set("origin", new URL(this.base).origin);
    if (headers.get("origin") === "") headers.delete("origin");
    const res = await fetch(this.base + path, { ...init, headers, redirect: "manual" });
    this.remember(res);
    return res;
  }

  /** Returns the error code next-auth reports, or null on success. */
  async signIn(email: string, password: string, ip = "198.51.100.7"): Promise<string | null> {
    const { csrfToken } = (await (await this.fetch("/api/auth/csrf")).json()) as { csrfToken: string };
    const res = await this.fetch("/api/auth/callback/credentials", {
      method: "POST",
      headers: { "content-type": "application/x-www-form-urlencoded", "x-forwarded-for": ip },
      body: new URLSearchParams({ csrfToken, email, password, json: "true" }),
    });
    // With json=true next-auth answers {url}; otherwise it redirects. Either way the error rides in the URL.
    const target = res.headers.get("content-type")?.includes("json")
      ? ((await res.json()) as { url: string }).url
      : (res.headers.get("location") ?? "");
    return new URL(target, this.base).searchParams.get("error");
  }

  json(path: string, method: string, body: unknown, headers: Record<string, string> = {}): Promise<Response> {
    return this.fetch(path, { method, headers: { "content-type": "application/json", ...headers }, body: JSON.stringify(body) });
  }
}

export function appUrl(): string {
  const url = process.env.TEST_APP_URL;
  if (!url) throw new Error("TEST_APP_URL is not set (integration global setup starts the app)");
  return url;
}
