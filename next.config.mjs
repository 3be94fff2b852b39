/** @type {import('next').NextConfig} */
const nextConfig = {
  poweredByHeader: false,
  reactStrictMode: true,
  // Native and Node-only packages stay outside the server bundle: knex would otherwise pull in
  // every dialect driver it supports, and better-sqlite3 is a native addon.
  serverExternalPackages: ["knex", "better-sqlite3", "pg", "pdf-lib", "@pdf-lib/fontkit", "bcryptjs", "sharp", "@aws-sdk/client-s3", "nodemailer", "qrcode"],
  typedRoutes: false,
};

export default nextConfig;
