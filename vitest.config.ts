import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

// The import aliases of tsconfig.json (Astro and tsx read them there; Vitest is told here).
const alias = {
  '@/': fileURLToPath(new URL('./src/', import.meta.url)),
  '@db/': fileURLToPath(new URL('./db/', import.meta.url)),
};

// Four projects: pure units, React components in jsdom, the HTTP API against the built server
// and the real MariaDB, and whole flows in Chromium. scripts/test.mjs starts the database and the
// server and passes their addresses in the environment (BONDMAP_TEST_URL, BONDMAP_DB_*).
export default defineConfig({
  test: {
    // Server-backed tests share one app server and one database; files run one after another.
    fileParallelism: false,
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'unit',
          include: ['tests/unit/**/*.test.ts'],
          environment: 'node',
        },
      },
      {
        resolve: { alias },
        esbuild: { jsx: 'automatic' },
        test: {
          name: 'components',
          include: ['tests/components/**/*.test.{ts,tsx}'],
          environment: 'jsdom',
          setupFiles: ['tests/helpers/setup-dom.ts'],
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          environment: 'node',
          testTimeout: 30000,
          hookTimeout: 120000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          testTimeout: 90000,
          hookTimeout: 120000,
        },
      },
    ],
  },
});
