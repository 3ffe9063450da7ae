// @ts-check
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwind from '@astrojs/tailwind';

export default defineConfig({
  output: 'server',
  adapter: node({ mode: 'standalone' }),
  integrations: [react(), tailwind({ applyBaseStyles: false })],
  // Astro refuses cross-site form posts; src/middleware.ts extends the same check to every non-GET.
  security: { checkOrigin: true },
  server: { host: '127.0.0.1', port: 4321 },
  vite: {
    ssr: { external: ['@node-rs/argon2', 'mariadb', 'sequelize', 'smtp-server', 'nodemailer'] },
  },
});
