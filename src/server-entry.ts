/**
 * The HTTP server (`node dist/server/serve.mjs`, what `npm start`, `npm test` and the bench run):
 * plain node:http with our own request listener (src/lib/server/request-listener.ts: `/api/…`
 * straight to Astro, everything else a file first) in front of Astro's handler. Bundled next to
 * Astro's entry at build time (see astro.config.mjs); HOST and PORT as before.
 */
import { createServer } from 'node:http';
import { fileURLToPath } from 'node:url';
import { requestListener, type AstroHandler } from '@/lib/server/request-listener';

const { handler } = (await import(/* @vite-ignore */ new URL('./entry.mjs', import.meta.url).href)) as { handler: AstroHandler };
const port = Number(process.env.PORT ?? 4321);
const host = process.env.HOST ?? '127.0.0.1';
createServer(requestListener(handler, fileURLToPath(new URL('../client/', import.meta.url)))).listen(port, host, () => console.log(`Bondmap listening on http://${host}:${port}`));
