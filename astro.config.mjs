// @ts-check
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwind from '@astrojs/tailwind';
import { build as esbuild } from 'esbuild';
import { fileURLToPath } from 'node:url';

/**
 * Two files of our own next to Astro's server entry, bundled after the server build (plain ESM):
 * the checker's worker thread (src/lib/server/check-worker.ts, the pure checker inlined, run by
 * src/lib/server/checking.ts) as dist/server/check-worker.mjs, and the HTTP server
 * (src/server-entry.ts: /api/* straight to Astro, everything else a file first) as
 * dist/server/serve.mjs.
 */
/** @returns {import('astro').AstroIntegration} */
function checkWorker() {
  /** @type {URL | undefined} */
  let serverDir;
  return {
    name: 'bondmap-check-worker',
    hooks: {
      'astro:config:done': ({ config }) => {
        serverDir = config.build.server;
      },
      'astro:build:done': async () => {
        const common = { bundle: true, platform: /** @type {const} */ ('node'), format: /** @type {const} */ ('esm'), target: 'node20', logLevel: /** @type {const} */ ('warning') };
        await esbuild({
          ...common,
          entryPoints: [fileURLToPath(new URL('./src/lib/server/check-worker.ts', import.meta.url))],
          outfile: fileURLToPath(new URL('check-worker.mjs', serverDir)),
        });
        await esbuild({
          ...common,
          entryPoints: [fileURLToPath(new URL('./src/server-entry.ts', import.meta.url))],
          outfile: fileURLToPath(new URL('serve.mjs', serverDir)),
          packages: 'external',
        });
      },
    },
  };
}

// Host names the server trusts in the Host header (Astro ignores any other and falls back to
// "localhost", which breaks the origin check). Deployments add theirs at build time.
const allowedHosts = ['127.0.0.1', 'localhost', ...(process.env.BONDMAP_ALLOWED_HOSTS ?? '').split(',').map((h) => h.trim()).filter(Boolean)];

export default defineConfig({
  output: 'server',
  // Middleware mode: src/server-entry.ts is the HTTP server and calls Astro's handler itself.
  adapter: node({ mode: 'middleware' }),
  integrations: [react(), tailwind({ applyBaseStyles: false }), checkWorker()],
  // src/middleware.ts refuses cross-site writes itself (forms and JSON alike, answering with the
  // JSON error shape), so Astro's own plain-text check is off.
  security: { checkOrigin: false, allowedDomains: allowedHosts.map((hostname) => ({ hostname })) },
  server: { host: '127.0.0.1', port: 4321 },
  vite: {
    ssr: { external: ['@node-rs/argon2', 'mariadb', 'sequelize', 'smtp-server', 'nodemailer', 'piscina', 'pino'] },
  },
});
