// @ts-check
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwind from '@astrojs/tailwind';

// Host names the server trusts in the Host header (Astro ignores any other and falls back to
// "localhost", which breaks the origin check). Deployments add theirs at build time.
const allowedHosts = ['127.0.0.1', 'localhost', ...(process.env.BONDMAP_ALLOWED_HOSTS ?? '').split(',').map((h) => h.trim()).filter(Boolean)];

export default defineConfig({
  output: 'server',
  adapter: node({ mode: 'standalone' }),
  integrations: [react(), tailwind({ applyBaseStyles: false })],
  // Astro refuses cross-site form posts; src/middleware.ts extends the same check to every non-GET.
  security: { checkOrigin: true, allowedDomains: allowedHosts.map((hostname) => ({ hostname })) },
  server: { host: '127.0.0.1', port: 4321 },
  vite: {
    ssr: { external: ['@node-rs/argon2', 'mariadb', 'sequelize', 'smtp-server', 'nodemailer'] },
  },
});
