/** @type {import('next').NextConfig} */
const nextConfig = {
  // The tests build into a folder of their own so that `npm test` can run while `npm start` serves.
  distDir: process.env.NEXT_DIST_DIR || '.next',
  // Sequelize loads its dialect driver dynamically; bundling it breaks that.
  serverExternalPackages: ['sequelize', 'pg', 'pg-hstore', 'pg-boss', 'nodemailer', 'socket.io', '@aws-sdk/client-s3', 'pdfkit', 'stripe'],
  poweredByHeader: false,
  reactStrictMode: true,
  // Static files are outside proxy.ts; they get the headers that do not need a nonce (API
  // answers get theirs in lib/security/api-guard).
  async headers() {
    return [
      {
        source: '/:path*',
        headers: [
          { key: 'X-Content-Type-Options', value: 'nosniff' },
          { key: 'Referrer-Policy', value: 'same-origin' },
          { key: 'X-Frame-Options', value: 'DENY' },
        ],
      },
    ];
  },
};

export default nextConfig;
