import { basename } from 'node:path';
import type { ServerResponse } from 'node:http';
import { Router } from 'express';
import expressStaticGzip from 'express-static-gzip';

/**
 * Angular's output hashing names a built file `name-HASH.ext` (eight or more capitals and digits),
 * and a new build gives a changed file a new name, so such a file can be cached for good.
 */
const hashedFileName = /-[A-Z0-9]{8,}\.[a-z0-9]+$/;

const cachedForGood = 'public, max-age=31536000, immutable';

/** Cache-Control for a built file: hashed names for a year, the page itself revalidated every time, the rest an hour. */
export function cacheControlFor(path: string): string {
  const name = basename(path).replace(/\.(br|gz)$/, '');
  if (name === 'index.html') return 'no-cache';
  return hashedFileName.test(name) ? cachedForGood : 'public, max-age=3600';
}

/**
 * The built client: each file as the brotli or gzip copy made at build time when the request's
 * Accept-Encoding allows it (brotli first, as it is the smaller), and every other GET, a client-side
 * route, gets the app's page.
 */
export function clientFilesRouter(clientFolder: string): Router {
  const router = Router();
  const files = expressStaticGzip(clientFolder, {
    enableBrotli: true,
    orderPreference: ['br', 'gzip'],
    index: false,
    serveStatic: {
      index: false,
      // serve-static's own max-age would overwrite ours, so headers are set here alone
      cacheControl: false,
      setHeaders: (response: ServerResponse, path: string) =>
        response.setHeader('Cache-Control', cacheControlFor(path)),
    },
  });
  router.use(files);
  router.get('/{*splat}', (request, response, next) => {
    request.url = '/index.html';
    files(request, response, next);
  });
  return router;
}
