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
  // Headers every response carries, static files included; the CSP with its nonce is set per request in proxy.ts.
  async headers() {
    const headers = [
      { key: 'X-Content-Type-Options', value: 'nosniff' },
      { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
      { key: 'X-Frame-Options', value: 'DENY' },
      { key: 'Permissions-Policy', value: 'camera=(), microphone=(), geolocation=(), payment=()' },
      { key: 'Cross-Origin-Opener-Policy', value: 'same-origin' },
    ];
    if (process.env.NODE_ENV === 'production') {
      headers.push({ key: 'Strict-Transport-Security', value: 'max-age=63072000; includeSubDomains' });
    }
    // JSON answers of the API: nothing in them may load or run, and no page may frame them.
    const api = [{ key: 'Content-Security-Policy', value: "default-src 'none'; frame-ancestors 'none'" }];
    return [
      { source: '/:path*', headers },
      { source: '/api/v1/:path*', headers: api },
    ];
  },
};

export default nextConfig;
