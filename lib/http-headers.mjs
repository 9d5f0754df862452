// The headers Epicycle puts on its answers, in one place: next.config.mjs gives them to every response Next serves,
// and the answer fast path (server/ingest.ts) to the participant answers it serves itself, so the two cannot drift.

/** Headers every response carries, static files included (the CSP with its nonce is set per page in proxy.ts). */
export function siteHeaders(isProduction) {
  const headers = [
    { key: 'X-Content-Type-Options', value: 'nosniff' },
    { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
    { key: 'X-Frame-Options', value: 'DENY' },
    { key: 'Permissions-Policy', value: 'camera=(), microphone=(), geolocation=(), payment=()' },
    { key: 'Cross-Origin-Opener-Policy', value: 'same-origin' },
  ];
  if (isProduction) headers.push({ key: 'Strict-Transport-Security', value: 'max-age=63072000; includeSubDomains' });
  return headers;
}

/** JSON answers of the API (/api/v1): nothing in them may load or run, and no page may frame them. */
export const API_HEADERS = [{ key: 'Content-Security-Policy', value: "default-src 'none'; frame-ancestors 'none'" }];
