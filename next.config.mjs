/** @type {import('next').NextConfig} */
const nextConfig = {
  // The tests build into a folder of their own so that `npm test` can run while `npm start` serves.
  distDir: process.env.NEXT_DIST_DIR || '.next',
  // Sequelize loads its dialect driver dynamically; bundling it breaks that.
  serverExternalPackages: ['sequelize', 'pg', 'pg-hstore', 'pg-boss', 'nodemailer', 'socket.io', '@aws-sdk/client-s3', 'pdfkit', 'stripe'],
  poweredByHeader: false,
  reactStrictMode: true,
};

export default nextConfig;
