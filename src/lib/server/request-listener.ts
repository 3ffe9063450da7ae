/**
 * The node:http request listener in front of Astro's handler (the Node adapter in middleware
 * mode; src/server-entry.ts starts the server with it).
 *
 * - `/api/…` goes straight to Astro: no file is ever served from there, so the static-file look-up
 *   (a stat of a path under dist/client on every request) is skipped.
 * - Everything else is a file from the client directory when there is one, as the adapter's own
 *   server did (dotfiles refused except under /.well-known/, hashed assets under /_astro/ cached
 *   for a year), and a page from Astro otherwise; a directory is never listed or redirected, it
 *   goes to Astro.
 * - A URL that cannot be decoded is 400, as before.
 *
 * Request ids, logging, security headers and the CSP come from src/middleware.ts, which runs for
 * every answer Astro gives (API and pages alike).
 */
import type { IncomingMessage, RequestListener, ServerResponse } from 'node:http';
import send from 'send';

/** Astro's handler as the Node adapter exports it in middleware mode. */
export type AstroHandler = (req: IncomingMessage, res: ServerResponse) => Promise<void>;

/** Serves the request's file from `root`, or calls `fallback` when there is none (or it is a directory or a dotfile). */
function serveFile(root: string, req: IncomingMessage, res: ServerResponse, fallback: () => void): void {
  const path = (req.url ?? '/').split(/[?#]/, 1)[0];
  let found = false;
  send(req, path, { root, index: false, dotfiles: path.startsWith('/.well-known/') ? 'allow' : 'deny' })
    .on('file', () => (found = true))
    .on('directory', () => fallback())
    .on('headers', (response: ServerResponse) => {
      if (path.startsWith('/_astro/')) response.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
    })
    .on('error', (error: Error) => {
      if (!found) return fallback();
      console.error(error);
      if (!res.headersSent) res.writeHead(500);
      res.end('Internal server error');
    })
    .pipe(res);
}

export function requestListener(handler: AstroHandler, clientDir: string): RequestListener {
  return (req, res) => {
    const url = req.url ?? '/';
    try {
      decodeURI(url);
    } catch {
      res.writeHead(400);
      res.end('Bad request.');
      return;
    }
    if (url.startsWith('/api/')) void handler(req, res);
    else serveFile(clientDir, req, res, () => void handler(req, res));
  };
}
