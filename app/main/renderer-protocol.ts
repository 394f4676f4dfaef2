import { readFile } from 'node:fs/promises';
import { extname } from 'node:path';
import { contentSecurityPolicy } from '../host/content-security-policy';
import { resolveInside } from '../host/browser-mode/static-files';
import { appOrigin } from './security';

const types: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.map': 'application/json',
};

/**
 * The app:// protocol handler: serves only files of the built renderer (path-guarded) and
 * attaches the Content-Security-Policy to every response, so no page can load anything
 * that is not the app's own.
 */
export function rendererProtocolHandler(rendererDir: string): (request: Request) => Promise<Response> {
  const csp = contentSecurityPolicy();
  return async (request) => {
    const url = new URL(request.url);
    if (`${url.protocol}//${url.host}` !== appOrigin) return new Response('not found', { status: 404 });
    const file = resolveInside(rendererDir, url.pathname);
    if (!file) return new Response('not found', { status: 404 });
    try {
      const body = await readFile(file);
      return new Response(body, {
        status: 200,
        headers: {
          'Content-Type': types[extname(file)] ?? 'application/octet-stream',
          'Content-Security-Policy': csp,
          'X-Content-Type-Options': 'nosniff',
        },
      });
    } catch {
      return new Response('not found', { status: 404 });
    }
  };
}
