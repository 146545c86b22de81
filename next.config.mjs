/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize loads its dialect with a dynamic require; keep it out of the bundle.
  serverExternalPackages: ['sequelize', 'pg', 'pg-hstore'],
  // Tests build into their own folder so they never collide with a running `npm start`.
  distDir: process.env.NEXT_DIST_DIR || '.next',
  poweredByHeader: false,
  reactStrictMode: true,
};

export default nextConfig;
