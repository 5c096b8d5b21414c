// @ts-check
import { defineConfig, envField } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwindcss from '@tailwindcss/vite';
import { CSP_DIRECTIVES } from './src/stack/headers.mjs';

// the public host (behind a proxy) must be trusted too, or same-origin form posts are refused
const publicHost = process.env.PUBLIC_BASE_URL ? new URL(process.env.PUBLIC_BASE_URL).hostname : null;
const allowedDomains = [{ hostname: '127.0.0.1' }, { hostname: 'localhost' }];
if (publicHost && !allowedDomains.some((d) => d.hostname === publicHost)) allowedDomains.push({ hostname: publicHost });

export default defineConfig({
  output: 'server',
  // the test command builds into its own throwaway folder so parallel runs never share a build
  outDir: process.env.WALLPULSE_OUT_DIR ?? './dist',
  adapter: node({ mode: 'standalone' }),
  integrations: [react()],
  server: { host: '127.0.0.1', port: 4321 },
  security: {
    checkOrigin: true,
    allowedDomains,
  },
  env: {
    schema: {
      DATABASE_URL: envField.string({ context: 'server', access: 'secret' }),
      SMTP_URL: envField.string({ context: 'server', access: 'secret', default: 'smtp://127.0.0.1:2525' }),
      // not secrets, but astro inlines "public" server variables at build time; these must be read when
      // the server starts, so that PORT or PUBLIC_BASE_URL given to `npm start` reach the e-mailed links
      MAIL_FROM: envField.string({ context: 'server', access: 'secret', default: 'Wallpulse <no-reply@wallpulse.local>' }),
      PUBLIC_BASE_URL: envField.string({ context: 'server', access: 'secret', default: 'http://127.0.0.1:4321' }),
      // the proxies whose X-Forwarded-For is believed (comma-separated addresses, CIDR ranges or
      // proxy-addr's names such as loopback); empty: the socket's address is the client. The
      // server in src/stack/serve.mjs applies it before Astro sees the request.
      TRUSTED_PROXIES: envField.string({ context: 'server', access: 'secret', default: '' }),
    },
    validateSecrets: false,
  },
  vite: {
    plugins: [tailwindcss()],
    worker: { format: 'es' },
  },
  devToolbar: { enabled: false },
  experimental: {
    // Astro adds script-src and style-src with the hashes of the inline scripts and styles it
    // writes (island hydration) to these, as the Content-Security-Policy header of every page
    csp: { algorithm: 'SHA-256', directives: /** @type {any} */ (CSP_DIRECTIVES) },
  },
});
