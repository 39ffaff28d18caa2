// A small HTTP client for the test server that signs in through next-auth's real credentials flow
// and keeps the session cookie.
export const baseURL = process.env.SHUNTWISE_TEST_URL ?? "http://127.0.0.1:3100";

export class Client {
  private cookies = new Map<string, string>();

  private remember(res: Response) {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(";");
      const i = pair.indexOf("=");
      this.cookies.set(pair.slice(0, i), pair.slice(i + 1));
    }
  }

  /** A second client holding a copy of this one's cookies (a copied session token). */
  copy(): Client {
    const c = new Client();
    for (const [k, v] of this.cookies) c.cookies.set(k, v);
    return c;
  }

  private cookieHeader(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join("; ");
  }

  async fetch(path: string, init: RequestInit = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    if (this.cookies.size) headers.set("cookie", this.cookieHeader());
    // as a browser does for every POST, PUT, PATCH and DELETE (the API refuses them without it)
    const method = (init.method ?? "GET").toUpperCase();
    if (method !== "GET" && method !== "HEAD" && !headers.has("origin")) headers.set("origin", new URL(baseURL).origin);
    const res = await fetch(baseURL + path, { ...init, headers, redirect: "manual" });
    this.remember(res);
    return res;
  }

  async json(path: string, init: RequestInit = {}): Promise<{ status: number; body: any; text: string }> {
    const res = await this.fetch(path, init);
    const text = await res.text();
    let body: unknown = null;
    try {
      body = JSON.parse(text);
    } catch {
      body = null;
    }
    return { status: res.status, body, text };
  }

  post(path: string, data: unknown) {
    return this.json(path, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(data) });
  }

  /** Signs in with e-mail and password; resolves to true when a session cookie was set. */
  async signIn(email: string, password: string): Promise<boolean> {
    const csrf = await this.json("/api/auth/csrf");
    const form = new URLSearchParams({ csrfToken: csrf.body.csrfToken, email, password, json: "true" });
    await this.fetch("/api/auth/callback/credentials", {
      method: "POST",
      headers: { "content-type": "application/x-www-form-urlencoded" },
      body: form.toString(),
    });
    return [...this.cookies.keys()].some((k) => k.endsWith("next-auth.session-token"));
  }
}
