// The web app manifest and the service worker's caching rules (read by astro.config.mjs at build
// time). Plain JavaScript so the config can import it without a TypeScript step.
import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

/** Technician pages: static shells whose data comes from the device database. */
export const TECHNICIAN_SHELLS = ['/round', '/visit', '/device', '/van', '/calculators'];

/** @type {Partial<import('vite-plugin-pwa').ManifestOptions>} */
export const pwaManifest = {
  name: 'Tickover',
  short_name: 'Tickover',
  description: 'Today’s round, checklists, readings and sign-off, with or without signal.',
  id: '/round',
  start_url: '/round',
  scope: '/',
  display: 'standalone',
  orientation: 'portrait',
  theme_color: '#0d5c63',
  background_color: '#f7f5f0',
  lang: 'en-GB',
  icons: [
    { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png', purpose: 'any' },
    { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'any' },
    { src: '/icons/maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
    { src: '/icons/icon.svg', sizes: 'any', type: 'image/svg+xml', purpose: 'any' },
  ],
};

const shellPattern = new RegExp(`^(${TECHNICIAN_SHELLS.map((p) => p.replace('/', '\\/')).join('|')})(\\/|\\?|$)`);

const CLIENT_DIR = fileURLToPath(new URL('../../dist/client/', import.meta.url));

// An asset named anywhere in a page, script or style sheet: "/_astro/x.js", "_astro/x.css" (Vite's
// preload map), url(/_astro/font.woff2), and a chunk's relative imports ("./y.js").
const ASSET_REF = /(?:\.{0,2}\/)?_astro\/[\w.-]+\.(?:js|css|woff2)/g;
const RELATIVE_REF = /["'`]\.\/([\w.-]+\.(?:js|css))["'`]/g;

/**
 * The files the technician's pages can load: the shells and everything reachable from them
 * through scripts (static and dynamic imports), style sheets and fonts; plus the icons. The
 * office console's scripts are in the same build but never needed on a phone, so they stay out.
 * @param {Set<string>} files every file of the client build, relative to it
 * @param {(file: string) => string} read
 */
export function technicianFiles(files, read) {
  const keep = new Set([...files].filter((f) => !f.startsWith('_astro/')));
  const queue = [...keep].filter((f) => f.endsWith('.html'));
  while (queue.length) {
    const file = queue.pop();
    const text = read(file);
    const found = [...text.matchAll(ASSET_REF)].map((m) => m[0].replace(/^(\.{0,2}\/)+/, ''));
    if (file.startsWith('_astro/')) found.push(...[...text.matchAll(RELATIVE_REF)].map((m) => `_astro/${m[1]}`));
    for (const ref of found) {
      if (!files.has(ref) || keep.has(ref)) continue;
      keep.add(ref);
      if (!ref.endsWith('.woff2')) queue.push(ref);
    }
  }
  return keep;
}

/** Precache entries: shell pages under their clean URL (round/index.html -> round), and only the technician's files. */
function technicianManifest(entries) {
  const files = new Set(entries.map((e) => e.url));
  const read = (file) => readFileSync(CLIENT_DIR + file, 'utf8');
  const keep = existsSync(CLIENT_DIR) ? technicianFiles(files, read) : files;
  const manifest = entries
    .filter((e) => keep.has(e.url))
    .map((e) => (e.url.endsWith('/index.html') ? { ...e, url: e.url.slice(0, -'/index.html'.length) } : e));
  return { manifest, warnings: [] };
}

/** @type {Partial<import('workbox-build').GenerateSWOptions>} */
export const technicianWorkbox = {
  // Files of the client build, then narrowed to what the technician's pages load (see
  // technicianFiles). Server-rendered pages (office, sign-in) are not files here at all.
  globPatterns: ['**/*.{js,css,html,svg,png,woff2}'],
  // Replaces @vite-pwa/astro's own transform, whose page-URL mapping it also does.
  manifestTransforms: [async (entries) => technicianManifest(entries)],
  // /visit?id=… is the one /visit shell; no precached file differs by query.
  ignoreURLParametersMatching: [/.*/],
  // A technician route the precache does not hold exactly (say /round/) still opens offline.
  navigateFallback: '/round',
  navigateFallbackAllowlist: [shellPattern],
  navigateFallbackDenylist: [/^\/api\//, /^\/office(\/|$)/, /^\/sign-in/, /^\/record\//],
  cleanupOutdatedCaches: true,
  // The new worker waits until the technician says "update" (src/lib/device/pwa.ts).
  skipWaiting: false,
  clientsClaim: false,
};
