// The web app manifest and the service worker's caching rules (read by astro.config.mjs at build
// time). Plain JavaScript so the config can import it without a TypeScript step.

/** Technician pages: static shells whose data comes from the device database. */
export const TECHNICIAN_SHELLS = ['/round', '/visit', '/device', '/calculators'];

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

/** @type {Partial<import('workbox-build').GenerateSWOptions>} */
export const technicianWorkbox = {
  // Everything the client build wrote: the shell pages, scripts, styles, fonts and icons. Server
  // rendered pages (office, sign-in) are not files here, so they are never precached.
  globPatterns: ['**/*.{js,css,html,svg,png,woff2}'],
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
