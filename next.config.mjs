/** @type {import('next').NextConfig} */
const securityHeaders = [
  { key: 'X-Content-Type-Options', value: 'nosniff' },
  { key: 'Referrer-Policy', value: 'same-origin' },
  { key: 'X-Frame-Options', value: 'DENY' },
];
// Pages get their policy, with a per-request nonce, from proxy.ts. API responses are data (JSON,
// reports, field-note photos): opened directly, nothing in them may run. Inline style stays, for the
// page Chromium itself wraps round an image opened on its own (it centres it with inline styles).
const apiPolicy = "default-src 'none'; style-src 'unsafe-inline'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'; sandbox";

const nextConfig = {
  // NEXT_DIST_DIR lets two builds live side by side (say, a developer's and a test run's).
  distDir: process.env.NEXT_DIST_DIR || '.next',
  // Sequelize finds its SQLite driver at run time; bundled, it cannot (and the build fails on pg-hstore).
  serverExternalPackages: ['sequelize', 'sqlite3'],
  poweredByHeader: false,
  // For a quick local build while other work is mid-edit; `npm test` always type-checks.
  typescript: { ignoreBuildErrors: process.env.PLUMEWARD_SKIP_BUILD_TYPECHECK === '1' },
  typedRoutes: false,
  async headers() {
    return [
      { source: '/:path*', headers: securityHeaders },
      { source: '/api/:path*', headers: [{ key: 'Content-Security-Policy', value: apiPolicy }] },
    ];
  },
};

export default nextConfig;
