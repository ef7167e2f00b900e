// @ts-check
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwindcss from '@tailwindcss/vite';

export default defineConfig({
  output: 'server',
  adapter: node({ mode: 'standalone' }),
  integrations: [react()],
  server: { host: '127.0.0.1', port: 4321 },
  // Our own middleware sets the security headers; Astro's origin check stays on for forms.
  security: { checkOrigin: true },
  vite: {
    plugins: [tailwindcss()],
  },
});
