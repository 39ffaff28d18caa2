// The JSON client every client component uses: success bodies come back parsed, the API's error shape
// comes back as an ApiError with its code, message and fields, and a dead server is status 0. Runs
// against a real HTTP server on a free port (no stubbed fetch).
import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { api, ApiError, asJson, isApiError, toApiError } from "@/lib/http/client";

let server: Server;
let base = "";
const seen: { method?: string; type?: string; body: string }[] = [];

beforeAll(async () => {
  server = createServer((req, res) => {
    let body = "";
    req.on("data", (c) => (body += c));
    req.on("end", () => {
      seen.push({ method: req.method, type: req.headers["content-type"], body });
      const send = (status: number, text: string, type = "application/json") => {
        res.writeHead(status, { "content-type": type });
        res.end(text);
      };
      if (req.url === "/ok") return send(200, JSON.stringify({ lab: { id: "l1" } }));
      if (req.url === "/echo") return send(201, body);
      if (req.url === "/invalid")
        return send(400, JSON.stringify({ error: { code: "bad_request", message: "Check the highlighted fields.", fields: { title: ["Required."] } } }));
      if (req.url === "/gateway") return send(502, "<html>Bad gateway</html>", "text/html");
      if (req.url === "/empty") return send(204, "");
      send(404, JSON.stringify({ error: { code: "not_found", message: "That lab was not found." } }));
    });
  });
  await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});

afterAll(async () => {
  await new Promise<void>((r) => server.close(() => r()));
});

describe("api()", () => {
  it("returns the parsed body of a 2xx", async () => {
    await expect(api<{ lab: { id: string } }>(`${base}/ok`)).resolves.toEqual({ lab: { id: "l1" } });
  });

  it("sends a body as JSON with the method given", async () => {
    await expect(api(`${base}/echo`, { method: "PATCH", body: { title: "Shunt" } })).resolves.toEqual({ title: "Shunt" });
    const last = seen.at(-1)!;
    expect(last.method).toBe("PATCH");
    expect(last.type).toBe("application/json");
  });

  it("throws the API's error with its code, message and field errors", async () => {
    const e = await api(`${base}/invalid`, { method: "POST", body: {} }).catch((x: unknown) => x);
    expect(isApiError(e)).toBe(true);
    const err = e as ApiError;
    expect(err.status).toBe(400);
    expect(err.code).toBe("bad_request");
    expect(err.message).toBe("Check the highlighted fields.");
    expect(err.fields).toEqual({ title: ["Required."] });
    expect(err.detail).toEqual({ code: "bad_request", message: "Check the highlighted fields.", fields: { title: ["Required."] } });
  });

  it("names the status when the answer is not the API's JSON", async () => {
    const err = (await api(`${base}/gateway`).catch((x: unknown) => x)) as ApiError;
    expect(err.status).toBe(502);
    expect(err.code).toBe("bad_response");
    expect(err.message).toBe("The request failed (HTTP 502).");
    expect(err.detail).toEqual({});
  });

  it("reads an empty success as null", async () => {
    await expect(api(`${base}/empty`, { method: "DELETE" })).resolves.toBeNull();
  });

  it("reports a server that does not answer as status 0", async () => {
    const closed = createServer();
    await new Promise<void>((r) => closed.listen(0, "127.0.0.1", r));
    const port = (closed.address() as AddressInfo).port;
    await new Promise<void>((r) => closed.close(() => r()));
    const err = (await api(`http://127.0.0.1:${port}/ok`).catch((x: unknown) => x)) as ApiError;
    expect(err.status).toBe(0);
    expect(err.code).toBe("network");
  });
});

describe("toApiError and asJson", () => {
  it("keeps the server's words apart from the fallback", () => {
    expect(toApiError(413, { error: { code: "payload_too_large", message: "The file is 12 MB; the limit is 10 MB." } }).detail.message).toBe("The file is 12 MB; the limit is 10 MB.");
    expect(toApiError(0, null).detail).toEqual({});
  });

  it("turns dates into the ISO strings the API sends", () => {
    const at = new Date("2026-12-02T05:00:00.000Z");
    expect(asJson({ submittedAt: at, band: [1, 2] as [number, number], gone: undefined })).toEqual({ submittedAt: "2026-12-02T05:00:00.000Z", band: [1, 2] });
  });
});
