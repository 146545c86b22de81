/** @type {import('next').NextConfig} */

// Pages get their Content Security Policy, with a fresh nonce, from proxy.ts
// (lib/server/http/content-security-policy.ts). Everything else (API answers, files) gets this one: it
// runs no scripts at all.
const staticCsp =
  "default-src 'none'; img-src 'self'; font-src 'self'; style-src 'self'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";

const securityHeaders = [
  { key: 'X-Frame-Options', value: 'DENY' },
  { key: 'X-Content-Type-Options', value: 'nosniff' },
  { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
  { key: 'Permissions-Policy', value: 'camera=(self), microphone=(), geolocation=(), payment=()' },
  { key: 'Cross-Origin-Opener-Policy', value: 'same-origin' },
  // Always sent: these headers are fixed when the app is built, not when it starts, and browsers
  // ignore HSTS received over plain http (RFC 6797, section 8.1), so local http is unaffected.
  { key: 'Strict-Transport-Security', value: 'max-age=31536000; includeSubDomains' },
];

/** What every file under /_next/static/ carries; scripts/server.mjs sends the same when it answers with Brotli. */
export const staticFileHeaders = [...securityHeaders, { key: 'Content-Security-Policy', value: staticCsp }];

const nextConfig = {
  // Sequelize loads its dialect with a dynamic require; keep it out of the bundle.
  serverExternalPackages: ['sequelize', 'pg', 'pg-hstore', 'pino', 'prom-client'],
  // Tests build into their own folder so they never collide with a running `npm start`.
  distDir: process.env.NEXT_DIST_DIR || '.next',
  poweredByHeader: false,
  // Browser source maps for profiling a page (scripts/profile-page.ts), and only in the tests' build folder: a
  // deployment's build (.next) never publishes them, whatever an .env file says.
  productionBrowserSourceMaps:
    process.env.BORELINE_BROWSER_SOURCEMAPS === '1' && process.env.NEXT_DIST_DIR === '.next-test',
  // Read when the server starts (scripts/server.mjs). Behind a declared reverse proxy
  // (TRUSTED_PROXY_HOPS >= 1) compression is the proxy's job and gzip in Node would cost the app CPU
  // on every answer; on one machine with no proxy (0 or unset) nobody else compresses, so the app does
  // (gzip here; scripts/static-compression.mjs adds Brotli for the build's static files).
  compress: !(Number(process.env.TRUSTED_PROXY_HOPS) >= 1),
  reactStrictMode: true,
  // `npm test` runs `tsc --noEmit` over the whole project (tests and scripts too) before it builds, and says so
  // with BORELINE_TYPES_CHECKED=1: the build then skips its own, narrower type check (about 20 s of the suite's
  // two cores). Every other build (npm start, a real install) type-checks as usual.
  typescript: { ignoreBuildErrors: process.env.BORELINE_TYPES_CHECKED === '1' },
  async headers() {
    return [
      { source: '/:path*', headers: securityHeaders },
      // Files and API answers (pages get theirs from proxy.ts).
      { source: '/api/:path*', headers: [{ key: 'Content-Security-Policy', value: staticCsp }] },
      { source: '/_next/static/:path*', headers: [{ key: 'Content-Security-Policy', value: staticCsp }] },
    ];
  },
};

export default nextConfig;
