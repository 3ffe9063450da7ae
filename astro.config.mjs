// @ts-check
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwind from '@astrojs/tailwind';
import { build as esbuild } from 'esbuild';
import { fileURLToPath } from 'node:url';

/**
 * The checker's worker thread (src/lib/server/checking.ts) needs a file of its own next to the
 * server entry: after the server build, bundle src/lib/server/check-worker.ts into
 * dist/server/check-worker.mjs (plain ESM, the pure checker inlined).
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
        await esbuild({
          entryPoints: [fileURLToPath(new URL('./src/lib/server/check-worker.ts', import.meta.url))],
          outfile: fileURLToPath(new URL('check-worker.mjs', serverDir)),
          bundle: true,
          platform: 'node',
          format: 'esm',
          target: 'node20',
          logLevel: 'warning',
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
  adapter: node({ mode: 'standalone' }),
  integrations: [react(), tailwind({ applyBaseStyles: false }), checkWorker()],
  // src/middleware.ts refuses cross-site writes itself (forms and JSON alike, answering with the
  // JSON error shape), so Astro's own plain-text check is off.
  security: { checkOrigin: false, allowedDomains: allowedHosts.map((hostname) => ({ hostname })) },
  server: { host: '127.0.0.1', port: 4321 },
  vite: {
    ssr: { external: ['@node-rs/argon2', 'mariadb', 'sequelize', 'smtp-server', 'nodemailer', 'piscina', 'pino'] },
  },
});
