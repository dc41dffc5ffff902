/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize loads dialect modules dynamically; bundling it breaks (STACK.md pitfall 2).
  serverExternalPackages: [
    'sequelize',
    'sqlite3',
    'pg',
    'pg-hstore',
    'smtp-server',
    'exceljs',
    '@react-pdf/renderer',
  ],
  // Lets parallel builds (e.g. a browser-test run beside a dev server) use separate folders.
  distDir: process.env.NEXT_DIST_DIR || '.next',
  // The test command type-checks the whole tree first (tsc --noEmit); a second check inside
  // every build only doubles the build time.
  typescript: { ignoreBuildErrors: true },
  poweredByHeader: false,
  reactStrictMode: true,
};

export default nextConfig;
