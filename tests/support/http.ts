import { request as httpRequest } from "node:http";

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

  /**
   * POSTs chunks as a streamed body, without a Content-Length unless `headers` gives one. With `holdAfter`,
   * writing stops once that many bytes are sent and the request stays open, unended, until the server
   * answers: a server that cuts a body at a limit must answer without waiting for its end. A server that
   * answers before the body ends (413) and closes the connection is read as its answer; the write error the
   * client may then meet (EPIPE, reset) is what any client sees and is not the result. A write can still
   * race the server's close and lose an answer that was sent: then the request is sent once more.
   */
  async streamPost(path: string, headers: Record<string, string>, chunks: () => Iterable<Buffer>, opts: { holdAfter?: number } = {}): Promise<{ status: number; body: any }> {
    try {
      return await this.streamOnce(path, headers, chunks(), opts.holdAfter ?? Infinity);
    } catch (e) {
      if (!["EPIPE", "ECONNRESET"].includes((e as NodeJS.ErrnoException).code ?? "")) throw e;
      return this.streamOnce(path, headers, chunks(), opts.holdAfter ?? Infinity);
    }
  }

  private streamOnce(path: string, headers: Record<string, string>, chunks: Iterable<Buffer>, holdAfter: number): Promise<{ status: number; body: any }> {
    return new Promise((resolve, reject) => {
      const all: Record<string, string> = { origin: new URL(baseURL).origin, ...headers };
      if (!("content-length" in all)) all["transfer-encoding"] = "chunked";
      if (this.cookies.size) all.cookie = this.cookieHeader();
      let answered = false;
      const req = httpRequest(baseURL + path, { method: "POST", headers: all }, (res) => {
        answered = true;
        let text = "";
        const done = () => {
          let body: unknown = null;
          try {
            body = JSON.parse(text);
          } catch {
            body = null;
          }
          resolve({ status: res.statusCode ?? 0, body });
          req.destroy();
        };
        res.setEncoding("utf8");
        res.on("data", (d) => (text += d));
        res.on("end", done);
        // the connection closed right after the answer: what arrived is the answer
        res.on("error", done);
      });
      req.on("error", (e) => {
        if (!answered) reject(e);
      });
      const it = chunks[Symbol.iterator]();
      let sent = 0;
      const pump = () => {
        for (;;) {
          if (answered || req.destroyed) return;
          if (sent >= holdAfter) return; // wait, unended, for the answer
          const n = it.next();
          if (n.done) return void req.end();
          sent += n.value.length;
          if (!req.write(n.value)) return void req.once("drain", pump);
        }
      };
      pump();
    });
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
