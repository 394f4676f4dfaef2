import { createReadStream } from 'node:fs';
import { stat } from 'node:fs/promises';
import type { ServerResponse } from 'node:http';
import { extname, resolve, sep } from 'node:path';

const contentTypes: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.ico': 'image/x-icon',
  '.woff2': 'font/woff2',
  '.wasm': 'application/wasm',
};

/** Resolves a URL path inside `root`, or null when it would leave it (the path guard). */
export function resolveInside(root: string, urlPath: string): string | null {
  let decoded: string;
  try {
    decoded = decodeURIComponent(urlPath);
  } catch {
    return null;
  }
  if (decoded.includes('\0')) return null;
  const base = resolve(root);
  const target = resolve(base, `.${decoded.startsWith('/') ? decoded : `/${decoded}`}`);
  return target === base || target.startsWith(base + sep) ? target : null;
}

/** Serves a file of the built renderer; directories serve their index.html. */
export async function serveStatic(
  root: string,
  urlPath: string,
  response: ServerResponse,
  headers: Record<string, string>,
): Promise<boolean> {
  let file = resolveInside(root, urlPath);
  if (!file) return false;
  let info = await stat(file).catch(() => null);
  if (info?.isDirectory()) {
    file = resolve(file, 'index.html');
    info = await stat(file).catch(() => null);
  }
  if (!info?.isFile()) return false;
  response.writeHead(200, {
    ...headers,
    'Content-Type': contentTypes[extname(file)] ?? 'application/octet-stream',
    'Content-Length': String(info.size),
    'Cache-Control': 'no-store',
    'X-Content-Type-Options': 'nosniff',
  });
  createReadStream(file).pipe(response);
  return true;
}
