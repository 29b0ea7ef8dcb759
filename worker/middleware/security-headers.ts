import type { MiddlewareHandler } from 'hono';

/**
 * The Content-Security-Policy of every response. The front end is one bundled module script and Lit styles applied
 * through adoptedStyleSheets, so no inline script, no eval and no inline style are needed; the page only talks to
 * its own origin. web/public/_headers repeats this for static files the asset layer serves without the worker
 * (a test checks the two agree).
 */
export const CONTENT_SECURITY_POLICY = [
  "default-src 'self'",
  "script-src 'self'",
  "style-src 'self'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  "worker-src 'self' blob:",
  "object-src 'none'",
  "base-uri 'none'",
  "frame-ancestors 'none'",
  "form-action 'self'",
].join('; ');

/** Security headers set on every response the worker produces (API, page route, errors). */
export const SECURITY_HEADERS: Readonly<Record<string, string>> = {
  'Content-Security-Policy': CONTENT_SECURITY_POLICY,
  'X-Content-Type-Options': 'nosniff',
  'Referrer-Policy': 'no-referrer',
  'Cross-Origin-Opener-Policy': 'same-origin',
  'X-Frame-Options': 'DENY',
  'Permissions-Policy': 'camera=(), microphone=(), geolocation=(), usb=(), serial=()',
};

/** Middleware factory: adds SECURITY_HEADERS to the response after the handler (or error handler) ran. */
export function securityHeaders(): MiddlewareHandler {
  return async function addSecurityHeaders(c, next) {
    await next();
    // Responses passed through from the asset binding have immutable headers: copy before editing.
    const res = new Response(c.res.body, c.res);
    for (const [name, value] of Object.entries(SECURITY_HEADERS)) res.headers.set(name, value);
    c.res = res;
  };
}
