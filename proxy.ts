import { NextResponse, type NextRequest } from 'next/server';

/**
 * Sets the per-request CSP nonce and the security headers. The proxy only redirects and sets headers;
 * it never authorises (every route and action does that itself).
 */
export function proxy(request: NextRequest) {
  const nonce = Buffer.from(crypto.getRandomValues(new Uint8Array(16))).toString('base64');
  const isDev = process.env.NODE_ENV === 'development';
  const csp = buildContentSecurityPolicy(nonce, isDev);

  const requestHeaders = new Headers(request.headers);
  requestHeaders.set('x-nonce', nonce);
  // Next reads the request-side policy to put the nonce on its own scripts.
  requestHeaders.set('content-security-policy', csp);

  const response = NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set('content-security-policy', csp);
  return response;
}

/** The policy: scripts only with this request's nonce (dev mode also needs eval for fast refresh). */
export function buildContentSecurityPolicy(nonce: string, isDev: boolean): string {
  return [
    `default-src 'self'`,
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${isDev ? ` 'unsafe-eval'` : ''}`,
    // Inline style attributes carry computed geometry (SVG sizes, progress widths); no script can run from them.
    `style-src 'self' 'unsafe-inline'`,
    `img-src 'self' blob: data:`,
    `font-src 'self'`,
    `connect-src 'self'${isDev ? ' ws: wss:' : ''}`,
    `worker-src 'self' blob:`,
    `object-src 'none'`,
    `base-uri 'self'`,
    `form-action 'self'`,
    `frame-ancestors 'none'`,
  ].join('; ');
}

// The JSON API (/api/v1) skips the proxy: its answers run no script, so they need no nonce, and next.config.mjs gives
// them a fixed deny-all policy instead. Skipping it took a large share of the per-request cost of a participant's
// answer (measured by `npm run load`).
export const config = {
  matcher: [
    {
      source: '/((?!api/v1/|_next/static|_next/image|favicon.ico|fonts/).*)',
      missing: [{ type: 'header', key: 'next-router-prefetch' }, { type: 'header', key: 'purpose', value: 'prefetch' }],
    },
  ],
};
