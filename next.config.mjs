/** @type {import('next').NextConfig} */

const isDev = process.env.NODE_ENV === 'development';

// Content Security Policy the app passes: everything from our own origin. Next's App Router
// streams its payload through inline scripts, so script-src needs 'unsafe-inline' (no nonce on
// prerendered pages); 'unsafe-eval' only for next dev. Camera scanning uses getUserMedia and
// blob: frames; uploads preview as blob: images.
const csp = [
  "default-src 'self'",
  `script-src 'self' 'unsafe-inline'${isDev ? " 'unsafe-eval'" : ''}`,
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  "media-src 'self' blob:",
  "worker-src 'self' blob:",
  "manifest-src 'self'",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
].join('; ');

const securityHeaders = [
  { key: 'Content-Security-Policy', value: csp },
  { key: 'X-Frame-Options', value: 'DENY' },
  { key: 'X-Content-Type-Options', value: 'nosniff' },
  { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
  { key: 'Permissions-Policy', value: 'camera=(self), microphone=(), geolocation=(), payment=()' },
  { key: 'Cross-Origin-Opener-Policy', value: 'same-origin' },
  // Always sent: these headers are fixed when the app is built, not when it starts, and browsers
  // ignore HSTS received over plain http (RFC 6797, section 8.1), so local http is unaffected.
  { key: 'Strict-Transport-Security', value: 'max-age=31536000; includeSubDomains' },
];

const nextConfig = {
  // Sequelize loads its dialect with a dynamic require; keep it out of the bundle.
  serverExternalPackages: ['sequelize', 'pg', 'pg-hstore'],
  // Tests build into their own folder so they never collide with a running `npm start`.
  distDir: process.env.NEXT_DIST_DIR || '.next',
  poweredByHeader: false,
  // Compression is the reverse proxy's job (it terminates TLS in front of every app server; see
  // README, "Scaling past one machine"): gzip in Node costs the app CPU on every answer.
  compress: false,
  reactStrictMode: true,
  async headers() {
    return [{ source: '/:path*', headers: securityHeaders }];
  },
};

export default nextConfig;
