/** @type {import('next').NextConfig} */
const nextConfig = {
  poweredByHeader: false,
  reactStrictMode: true,
  // Native and Node-only packages stay outside the server bundle: knex would otherwise pull in
  // every dialect driver it supports, and better-sqlite3 is a native addon.
  serverExternalPackages: ["knex", "better-sqlite3", "pg", "pdf-lib", "@pdf-lib/fontkit", "bcryptjs", "sharp", "@aws-sdk/client-s3", "nodemailer", "qrcode"],
  typedRoutes: false,
  experimental: {
    // The proxy buffers request bodies for its checks; photo (15 MB) and PDF-check (25 MB)
    // uploads must reach their handlers whole. Each handler enforces its own, smaller limit.
    proxyClientMaxBodySize: "26mb",
  },
};

export default nextConfig;
