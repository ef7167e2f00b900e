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
  // Our own middleware sets the security headers; Astro's origin check stays on for forms.
  security: { checkOrigin: true },
  vite: {
    plugins: [tailwindcss()],
  },
});
