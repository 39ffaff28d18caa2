// The app's HTTP server: Next.js's production server behind a few lines that record who sent each
// request. Next.js does not give route handlers the socket's address (it only fills in X-Forwarded-For
// when the client sent none, so a client's own header would pass for its address), so this wrapper,
// Next.js's documented custom server (`next()` with `getRequestHandler()`), resolves the client's address
// from the socket and SHUNTWISE_TRUSTED_PROXIES before Next.js sees the request, and hands it on in a
// header the app believes only with this process's key (a client cannot set it: the wrapper replaces it).
//   node scripts/serve.mjs -H 127.0.0.1 -p 3000     (what `npm start` and `npm test` run)
import { randomBytes } from "node:crypto";
import { createServer } from "node:http";
import path from "node:path";
import { parseArgs } from "node:util";
import next from "next";
import { clientAddressOf, trustedProxies } from "./lib/client-address.mjs";

const { values } = parseArgs({ options: { hostname: { type: "string", short: "H", default: "127.0.0.1" }, port: { type: "string", short: "p", default: process.env.PORT ?? "3000" } } });
const port = Number(values.port);
const hostname = values.hostname;
const trusted = trustedProxies(process.env.SHUNTWISE_TRUSTED_PROXIES);
// The app reads the header only when it carries this key (lib/security/client.ts): the same process.
const key = randomBytes(18).toString("base64url");
process.env.SHUNTWISE_CLIENT_HEADER_KEY = key;
process.env.NODE_ENV ??= "production";

const app = next({ dev: false, dir: path.resolve(import.meta.dirname, ".."), hostname, port });
const handle = app.getRequestHandler();
// listening at once, as `next start` does (a taken port fails now, not after the app has loaded);
// requests wait for the app to be ready
const ready = app.prepare();

const server = createServer(async (req, res) => {
  const client = clientAddressOf(req.socket.remoteAddress, req.headers["x-forwarded-for"], trusted);
  req.headers["x-shuntwise-client"] = `${key} ${client}`;
  // Next.js keeps an X-Forwarded-For it finds; it now names the resolved client only
  req.headers["x-forwarded-for"] = client;
  await ready;
  await handle(req, res);
});
server.keepAliveTimeout = 65_000;
server.on("error", (e) => {
  console.error(`The app server cannot listen on ${hostname}:${port} (${e.message}).`);
  process.exit(1);
});
server.listen(port, hostname, () => console.log(`Shuntwise listening on http://${hostname}:${port}`));
await ready;

let closing = false;
for (const signal of ["SIGINT", "SIGTERM"]) {
  process.on(signal, () => {
    if (closing) return;
    closing = true;
    server.close();
    server.closeIdleConnections?.();
    void app.close().finally(() => process.exit(0));
    setTimeout(() => process.exit(0), 5000).unref();
  });
}
