/**
 * The pages may load only the app's own files and talk only to their own host. Inline
 * scripts and styles are refused; React sets styles through the DOM, which CSP allows.
 * `extraConnect` adds the browser-mode WebSocket address (Chromium treats ws: as a
 * different scheme from http:, so 'self' alone does not cover it).
 */
export function contentSecurityPolicy(extraConnect: readonly string[] = []): string {
  return [
    "default-src 'self'",
    "script-src 'self'",
    "style-src 'self'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    `connect-src 'self'${extraConnect.map((source) => ` ${source}`).join('')}`,
    "worker-src 'self' blob:",
    "object-src 'none'",
    "base-uri 'none'",
    "form-action 'none'",
    "frame-ancestors 'none'",
  ].join('; ');
}
