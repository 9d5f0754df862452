import { API_HEADERS, siteHeaders } from './lib/http-headers.mjs';

/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  // Compression belongs to the reverse proxy in front (README, "Running Epicycle for a department"): done here it
  // gzipped every small JSON answer and was the largest single cost of a participant's answer under load.
  compress: false,
  // Packages with Node-only internals stay outside the server bundle.
  serverExternalPackages: ['pg', 'pg-boss', 'bcryptjs', 'nodemailer', 'paper'],
  typedRoutes: false,
  // `npm test` type-checks the whole tree (tests included) as its first tier; the build need not do it again.
  typescript: { ignoreBuildErrors: true },
  outputFileTracingRoot: import.meta.dirname,
  // With proxy.ts in place, Next buffers only the first 10 MB of a request body; the pack check takes up to 600 MiB.
  experimental: { proxyClientMaxBodySize: '600mb' },
  // Headers every response carries (lib/http-headers.mjs, shared with the answer fast path in server/ingest.ts); the CSP
  // with its nonce is set per request in proxy.ts.
  async headers() {
    return [
      { source: '/:path*', headers: siteHeaders(process.env.NODE_ENV === 'production') },
      { source: '/api/v1/:path*', headers: [...API_HEADERS] },
    ];
  },
};

export default nextConfig;
