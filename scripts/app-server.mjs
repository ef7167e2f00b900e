// Serves the built app (dist/): the Node adapter's standalone handler, which answers static files
// itself and hands the rest to Astro, behind a server of ours that first sets the security
// headers (src/lib/server/security-policy.mjs). Astro's middleware never sees the static files
// (the technician's offline shells, the scripts, the service worker), so without this they would
// go out with no frame blocking, no nosniff and no HSTS. `node scripts/app-server.mjs` after
// `astro build`; HOST, PORT, and SERVER_CERT_PATH with SERVER_KEY_PATH for TLS, as the adapter reads.
import { readFileSync } from 'node:fs';
import http from 'node:http';
import https from 'node:https';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { securityHeaders, servedOverTls } from '../src/lib/server/security-policy.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');

// The built entry starts its own server when imported unless told not to.
process.env.ASTRO_NODE_AUTOSTART = 'disabled';
const { handler, options } = await import(pathToFileURL(join(root, 'dist', 'server', 'entry.mjs')).href);

function listener(request, response) {
  const tls = servedOverTls(request.headers['x-forwarded-proto']?.toString());
  // Set before the handler writes: Node merges these with the handler's own headers, and the
  // handler's win where both name one (a photo's nosniff, say).
  for (const [name, value] of Object.entries(securityHeaders({ tls }))) response.setHeader(name, value);
  handler(request, response);
}

const tlsFiles = process.env.SERVER_CERT_PATH && process.env.SERVER_KEY_PATH;
const server = tlsFiles
  ? https.createServer({ key: readFileSync(process.env.SERVER_KEY_PATH), cert: readFileSync(process.env.SERVER_CERT_PATH) }, listener)
  : http.createServer(listener);

const host = process.env.HOST ?? options.host ?? '127.0.0.1';
const port = Number(process.env.PORT ?? options.port ?? 4321);
server.listen(port, host, () => {
  console.log(`[tickover] serving ${tlsFiles ? 'https' : 'http'}://${host}:${port}`);
});
for (const signal of ['SIGINT', 'SIGTERM']) {
  process.once(signal, () => {
    // Finish what is in flight, but do not wait on idle keep-alive connections for long.
    server.close(() => process.exit(0));
    server.closeIdleConnections();
    setTimeout(() => process.exit(0), 5000).unref();
  });
}
