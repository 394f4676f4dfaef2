import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { IncomingMessage } from 'node:http';

/**
 * Browser mode's only protection on a shared machine: a random token per launch. The
 * printed URL carries it in the query; the first response turns it into an HttpOnly,
 * SameSite=Strict cookie so the page's scripts, styles, workers and WebSocket carry it
 * without ever exposing it to page scripts. The cookie name includes the port because
 * cookies are shared between ports of one host.
 */
export interface BrowserAuth {
  readonly token: string;
  readonly cookieName: string;
  /** How the request proved itself, or null when it did not. */
  check(request: IncomingMessage): 'query' | 'cookie' | null;
  setCookieHeader(): string;
}

export function createBrowserAuth(port: number, token = randomBytes(24).toString('base64url')): BrowserAuth {
  const cookieName = `gazeloom_${port}`;
  const expected = Buffer.from(token);
  const matches = (candidate: string | undefined | null): boolean => {
    if (!candidate) return false;
    const given = Buffer.from(candidate);
    return given.length === expected.length && timingSafeEqual(given, expected);
  };
  return {
    token,
    cookieName,
    check(request) {
      const url = new URL(request.url ?? '/', 'http://127.0.0.1');
      if (matches(url.searchParams.get('token'))) return 'query';
      if (matches(readCookie(request.headers.cookie, cookieName))) return 'cookie';
      return null;
    },
    setCookieHeader: () => `${cookieName}=${token}; HttpOnly; SameSite=Strict; Path=/`,
  };
}

export function readCookie(header: string | undefined, name: string): string | null {
  if (!header) return null;
  for (const part of header.split(';')) {
    const eq = part.indexOf('=');
    if (eq > 0 && part.slice(0, eq).trim() === name) return part.slice(eq + 1).trim();
  }
  return null;
}
