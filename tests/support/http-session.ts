import { fetchFrom } from "./bound-fetch";
import { serverActionBody, serverActionId } from "./server-action";

/** Sign in over HTTP the way a browser does (CSRF token, then the credentials callback) and keep the cookies. */
export class HttpSession {
  private cookies = new Map<string, string>();
  private readonly send: typeof fetch;

  /** `localAddress`: connect from this loopback address (the server sees it as the client's address). */
  constructor(
    readonly base: string,
    options: { localAddress?: string } = {},
  ) {
    this.send = options.localAddress ? fetchFrom(options.localAddress) : fetch;
  }

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

  /** Another client holding a copy of these cookies (a copied session token). */
  copy(): HttpSession {
    const other = new HttpSession(this.base);
    for (const [k, v] of this.cookies) other.cookies.set(k, v);
    return other;
  }

  /** Like a browser: unsafe methods carry this page's Origin unless the caller sets (or removes) it. */
  async fetch(path: string, init: RequestInit = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    if (this.cookies.size) headers.set("cookie", this.cookieHeader);
    const unsafe = !["GET", "HEAD", "OPTIONS"].includes((init.method ?? "GET").toUpperCase());
    if (unsafe && !headers.has("origin")) headers.set("origin", new URL(this.base).origin);
    if (headers.get("origin") === "") headers.delete("origin");
    const res = await this.send(this.base + path, { ...init, headers, redirect: "manual" });
    this.remember(res);
    return res;
  }

  private async csrfToken(): Promise<string> {
    return ((await (await this.fetch("/api/auth/csrf")).json()) as { csrfToken: string }).csrfToken;
  }

  /**
   * Returns the error code next-auth reports, or null on success. `forwardedFor` is an X-Forwarded-For header the
   * client writes itself; the app ignores it unless TRUSTED_PROXY_COUNT says proxies are in front.
   */
  async signIn(email: string, password: string, forwardedFor?: string): Promise<string | null> {
    const csrfToken = await this.csrfToken();
    const res = await this.fetch("/api/auth/callback/credentials", {
      method: "POST",
      headers: { "content-type": "application/x-www-form-urlencoded", ...(forwardedFor ? { "x-forwarded-for": forwardedFor } : {}) },
      body: new URLSearchParams({ csrfToken, email, password, json: "true" }),
    });
    // With json=true next-auth answers {url}; otherwise it redirects. Either way the error rides in the URL.
    const target = res.headers.get("content-type")?.includes("json")
      ? ((await res.json()) as { url: string }).url
      : (res.headers.get("location") ?? "");
    return new URL(target, this.base).searchParams.get("error");
  }

  /** Signs out as the sign-out button does; returns where next-auth sends the browser. */
  async signOut(callbackUrl = "/login"): Promise<string> {
    const csrfToken = await this.csrfToken();
    const res = await this.fetch("/api/auth/signout", {
      method: "POST",
      headers: { "content-type": "application/x-www-form-urlencoded" },
      body: new URLSearchParams({ csrfToken, callbackUrl, json: "true" }),
    });
    return ((await res.json()) as { url: string }).url;
  }

  json(path: string, method: string, body: unknown, headers: Record<string, string> = {}): Promise<Response> {
    return this.fetch(path, { method, headers: { "content-type": "application/json", ...headers }, body: JSON.stringify(body) });
  }

  /**
   * Calls a server action the way a form with useActionState does (POST to the page with the action's id), and
   * returns the action's result as the client would see it.
   */
  async action<T = unknown>(pagePath: string, file: string, exportName: string, fields: Record<string, string>, headers: Record<string, string> = {}): Promise<T> {
    const { body, contentType } = serverActionBody(fields);
    const res = await this.fetch(pagePath, {
      method: "POST",
      headers: { ...headers, "next-action": serverActionId(file, exportName), "content-type": contentType, origin: new URL(this.base).origin, accept: "text/x-component" },
      body,
    });
    const text = await res.text();
    if (res.status !== 200) throw new Error(`server action ${exportName} answered ${res.status}: ${text.slice(0, 200)}`);
    // The RSC payload's row 1 is the action's return value (row 0 is the router state).
    const row = text.split("\n").find((line) => line.startsWith("1:"));
    if (!row) throw new Error(`server action ${exportName} returned no result: ${text.slice(0, 200)}`);
    return JSON.parse(row.slice(2)) as T;
  }
}

export function appUrl(): string {
  const url = process.env.TEST_APP_URL;
  if (!url) throw new Error("TEST_APP_URL is not set (integration global setup starts the app)");
  return url;
}
