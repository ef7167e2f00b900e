// @ts-check
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwindcss from '@tailwindcss/vite';
import AstroPWA from '@vite-pwa/astro';
import { pwaManifest, technicianWorkbox } from './src/lib/pwa-config.mjs';

export default defineConfig({
  output: 'server',
  adapter: node({ mode: 'standalone' }),
  integrations: [
    react(),
    // The technician's phone app: a service worker that precaches the static shell pages
    // (/round, /visit, /device, /calculators) and their assets, so the app opens with no signal.
    AstroPWA({
      registerType: 'prompt',
      // Registered by src/lib/device/pwa.ts (workbox-window), which runs the update flow.
      injectRegister: false,
      manifest: pwaManifest,
      workbox: technicianWorkbox,
    }),
  ],
  server: { host: '127.0.0.1', port: 4321 },
  // Cross-site writes are refused by our middleware (src/lib/server/origin-check.ts), which
  // reads PUBLIC_BASE_URL and TRUST_PROXY when the server runs and covers every content type.
  // Astro's own check compares Origin with a URL it rebuilds from `allowedDomains`, fixed at build
  // time and `http://localhost` without it, so it refused same-site form posts and body-less
  // writes on 127.0.0.1 and behind a proxy while letting every JSON request through.
  security: { checkOrigin: false },
  vite: {
    plugins: [tailwindcss()],
  },
});
