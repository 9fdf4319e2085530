/**
 * The production server: Next.js behind a plain Node HTTP server, so each request's socket
 * address is known and forwarding headers are believed only from the proxies TRUSTED_PROXY
 * names (lib/net/forwarded.ts). `npm start` and `npm test` run it; `next dev` does not, and
 * there every client counts as "local".
 *
 *   PORT=3000 HOST=0.0.0.0 TRUSTED_PROXY="10.0.0.0/8" node --import tsx server.ts
 */
import { createServer } from "node:http";
import next from "next";
import { applyForwarding, parseTrustedProxies, TrustedProxyError } from "./lib/net/forwarded";
import { MALFORMED_PATH_BODY, wellFormedPath } from "./lib/net/request-target";
import { EnvError, requireServerEnv } from "./lib/env";

let settings;
let trusted;
try {
  // Every setting checked before anything starts: a bad one stops here, named.
  settings = requireServerEnv();
  trusted = parseTrustedProxies(settings.TRUSTED_PROXY);
} catch (err) {
  if (err instanceof TrustedProxyError || err instanceof EnvError) {
    console.error(err.message);
    process.exit(2);
  }
  throw err;
}

const { PORT: port, HOST: hostname } = settings;
const app = next({ dev: false, hostname, port, dir: import.meta.dirname });
await app.prepare();
const handle = app.getRequestHandler();

const server = createServer((req, res) => {
  applyForwarding(req.headers, req.socket.remoteAddress, trusted);
  if (!wellFormedPath(req.url ?? "/")) {
    res.writeHead(400, { "content-type": "application/json; charset=utf-8", "x-content-type-options": "nosniff" });
    res.end(MALFORMED_PATH_BODY);
    return;
  }
  handle(req, res).catch((err: unknown) => {
    console.error("[server] request failed:", err);
    if (!res.headersSent) res.writeHead(500, { "content-type": "text/plain" });
    res.end("Internal error");
  });
});
// Slow senders may not hold a connection open forever.
server.requestTimeout = 120_000;
server.headersTimeout = 30_000;
server.listen(port, hostname, () => {
  const proxies = trusted.entries.length ? `trusting forwarding headers from ${trusted.entries.join(", ")}` : "trusting no forwarding headers (TRUSTED_PROXY unset)";
  console.log(`Synledger listening on http://${hostname}:${port}, ${proxies}`);
});

for (const signal of ["SIGTERM", "SIGINT"] as const) {
  process.on(signal, () => {
    server.close(() => process.exit(0));
    setTimeout(() => process.exit(0), 10_000).unref();
  });
}
