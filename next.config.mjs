/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize loads dialect modules dynamically; bundling it breaks (STACK.md pitfall 2).
  serverExternalPackages: ['sequelize', 'sqlite3', 'pg', 'pg-hstore', 'smtp-server', 'exceljs', '@react-pdf/renderer'],
  poweredByHeader: false,
  reactStrictMode: true,
};

export default nextConfig;
