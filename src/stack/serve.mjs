// The app's HTTP server: the built Astro app (@astrojs/node, standalone build) behind a small
// node:http server of our own, because three things must happen before Astro sees a request
// and on every response, static files and error answers included:
//
//  1. the client address: X-Forwarded-For is believed only from the proxies named in
//     TRUSTED_PROXIES (proxy-addr); otherwise the socket's address is the client. Astro reads
//     the address from that header, so it is rewritten to the one address we trust.
//  2. body limits that count bytes as they arrive (chunked bodies too), per kind of route
//     (bodyLimits.mjs); a body past its limit is answered 413 and never held whole in memory.
//  3. the security headers (headers.mjs) on every response; Astro's own CSP with the hashes of
//     its inline scripts replaces the default on pages.
//
// Usage: node src/stack/serve.mjs <path to dist/server/entry.mjs>   (HOST, PORT from the environment)
import http from 'node:http';
import { pathToFileURL } from 'node:url';
import proxyaddr from 'proxy-addr';
import { bodyLimitFor, formatBytes } from './bodyLimits.mjs';
import { BASE_HEADERS } from './headers.mjs';

const entry = process.argv[2];
if (!entry) {
  console.error('usage: node src/stack/serve.mjs <dist/server/entry.mjs>');
  process.exit(2);
}
// the standalone entry would start its own server on import; we start ours instead
process.env.ASTRO_NODE_AUTOSTART = 'disabled';
const { handler } = await import(pathToFileURL(entry).href);

const trustList = (process.env.TRUSTED_PROXIES ?? '')
  .split(',')
  .map((s) => s.trim())
  .filter(Boolean);
const trust = proxyaddr.compile(trustList);

/** past this, a refused body is no longer read away: the connection is cut */
const DRAIN_CAP = 256 * 1024 * 1024;

function tooLarge(res, limit) {
  const body = JSON.stringify({ error: { code: 'too_large', message: `The request body is larger than ${formatBytes(limit)}, the limit for this address.` } });
  res.writeHead(413, { 'content-type': 'application/json', 'cache-control': 'no-store', 'content-length': Buffer.byteLength(body) });
  res.end(body);
}

/**
 * Read the rest of a refused body and drop it, so that the client, still sending, gets to
 * read the 413 (a connection cut mid-upload reaches most clients as a network error); nothing
 * is kept, and a body past DRAIN_CAP gets the connection cut after all.
 */
function drain(req, already) {
  let seen = already;
  req.removeAllListeners('data');
  req.on('data', (chunk) => {
    seen += chunk.length;
    if (seen > DRAIN_CAP) req.destroy();
  });
  req.resume();
}

const server = http.createServer((req, res) => {
  for (const [name, value] of BASE_HEADERS) res.setHeader(name, value);

  // 1. the address the server trusts; forwarded host and protocol only from a trusted proxy too
  const peerTrusted = trustList.length > 0 && trust(req.socket.remoteAddress ?? '', 0);
  req.headers['x-forwarded-for'] = proxyaddr(req, trust);
  if (!peerTrusted) {
    delete req.headers['x-forwarded-host'];
    delete req.headers['x-forwarded-proto'];
    delete req.headers['x-forwarded-port'];
  }

  // 2. the body, counted as it arrives
  const method = req.method ?? 'GET';
  if (method === 'GET' || method === 'HEAD') {
    handler(req, res);
    return;
  }
  const limit = bodyLimitFor(method, (req.url ?? '/').split('?')[0]);
  const declared = Number(req.headers['content-length'] ?? 0);
  if (declared > limit) {
    tooLarge(res, limit);
    drain(req, 0);
    return;
  }
  const chunks = [];
  let received = 0;
  let refused = false;
  req.on('data', (chunk) => {
    if (refused) return;
    received += chunk.length;
    if (received > limit) {
      refused = true;
      chunks.length = 0;
      tooLarge(res, limit);
      drain(req, received);
      return;
    }
    chunks.push(chunk);
  });
  req.on('error', () => {
    if (!res.headersSent) res.destroy();
  });
  req.on('end', () => {
    if (refused) return;
    const body = Buffer.concat(chunks, received);
    // Astro builds the web Request from req.body when it is an async iterable
    req.body = (async function* () {
      if (body.length > 0) yield body;
    })();
    handler(req, res);
  });
});

// a slow client must not hold a connection for ever
server.requestTimeout = 60_000;
server.headersTimeout = 20_000;

const host = process.env.HOST ?? '127.0.0.1';
const port = Number(process.env.PORT ?? 4321);
server.listen(port, host, () => {
  console.log(`[wallpulse] listening on http://${host}:${port}`);
});

for (const signal of ['SIGTERM', 'SIGINT']) {
  process.on(signal, () => {
    server.close(() => process.exit(0));
    server.closeAllConnections?.();
    setTimeout(() => process.exit(0), 2000).unref();
  });
}
