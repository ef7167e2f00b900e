// The security headers of every answer the server gives, in plain JavaScript so that both the
// app's middleware (src/middleware.ts, for rendered pages and the API) and the process that
// serves the build (scripts/app-server.mjs, which also serves the static files the middleware
// never sees: the technician's offline shells, scripts, the service worker) use the same ones.
import { createHash } from 'node:crypto';
import astroIsland from 'astro/runtime/server/astro-island.prebuilt.js';
import astroIslandDev from 'astro/runtime/server/astro-island.prebuilt-dev.js';
import idleDirective from 'astro/runtime/client/idle.prebuilt.js';
import loadDirective from 'astro/runtime/client/load.prebuilt.js';
import mediaDirective from 'astro/runtime/client/media.prebuilt.js';
import onlyDirective from 'astro/runtime/client/only.prebuilt.js';
import visibleDirective from 'astro/runtime/client/visible.prebuilt.js';

// The only inline scripts our pages carry are Astro's: the island element and one script per
// hydration directive (astro/dist/runtime/server/scripts.js writes them). Allowing exactly these by
// hash keeps 'unsafe-inline' out of script-src, so injected markup cannot run a script.
// tests/integration/security/headers.test.ts checks every inline script of the built pages is listed.
const sha256Source = (text) => `'sha256-${createHash('sha256').update(text, 'utf8').digest('base64')}'`;
export const INLINE_SCRIPT_HASHES = [astroIsland, astroIslandDev, idleDirective, loadDirective, mediaDirective, onlyDirective, visibleDirective].map(
  sha256Source,
);

// One year, the value browsers' preload lists ask for. Not includeSubDomains: a business may
// serve Tickover from one name of a domain whose other names are not ours to pin to HTTPS.
const HSTS = 'max-age=31536000';

/** The policy's directives; `forMeta` leaves out what a <meta> policy may not carry. */
export function contentSecurityPolicy({ forMeta = false, dev = false } = {}) {
  return [
    "default-src 'self'",
    // The Vite dev server injects inline module scripts of its own; a build never does.
    `script-src 'self' ${dev ? "'unsafe-inline'" : INLINE_SCRIPT_HASHES.join(' ')}`,
    // React and the dashboard's charts write style attributes; a style cannot run code.
    "style-src 'self' 'unsafe-inline'",
    // Photos on the phone are blob: URLs; signatures are shown as data: images.
    "img-src 'self' blob: data:",
    "font-src 'self'",
    "connect-src 'self'",
    "worker-src 'self'",
    "manifest-src 'self'",
    "frame-src 'none'",
    ...(forMeta ? [] : ["frame-ancestors 'none'"]),
    "base-uri 'self'",
    "form-action 'self'",
    "object-src 'none'",
  ].join('; ');
}

/**
 * Headers for one answer. `tls` says whether the request reached us over TLS (servedOverTls):
 * only then is HSTS sent, since a browser ignores it over plain HTTP and a test or a LAN install
 * on http:// must not be told to insist on HTTPS.
 */
export function securityHeaders({ tls = false, dev = false } = {}) {
  const headers = {
    'content-security-policy': contentSecurityPolicy({ dev }),
    'x-frame-options': 'DENY',
    'x-content-type-options': 'nosniff',
    'referrer-policy': 'same-origin',
    // The visit page takes photos with the camera; nothing here needs the microphone, location,
    // payment or USB, so no page (or anything it might embed) may ask for them.
    'permissions-policy': 'camera=(self), microphone=(), geolocation=(), payment=(), usb=()',
    'cross-origin-opener-policy': 'same-origin',
  };
  if (tls) headers['strict-transport-security'] = HSTS;
  return headers;
}

/** The last value of a comma-separated header: the one our own proxy appended or set. */
export function lastHeaderValue(value) {
  if (!value) return undefined;
  return value.split(',').map((v) => v.trim()).filter(Boolean).at(-1);
}

/**
 * Whether the request reached us over TLS: the server holds the certificate itself (the Node
 * adapter's SERVER_CERT_PATH and SERVER_KEY_PATH), or a proxy we trust (TRUST_PROXY=1) says so in
 * X-Forwarded-Proto. Without TRUST_PROXY that header is anyone's to write, so it counts for nothing.
 */
export function servedOverTls(forwardedProto, env = process.env) {
  if (env.SERVER_CERT_PATH && env.SERVER_KEY_PATH) return true;
  if (env.TRUST_PROXY !== '1') return false;
  return lastHeaderValue(forwardedProto)?.toLowerCase() === 'https';
}
