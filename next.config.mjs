/** @type {import('next').NextConfig} */
const nextConfig = {
  // knex pulls optional drivers that Turbopack cannot bundle; keep it (and the
  // other Node-only server packages) external.
  serverExternalPackages: ['knex', 'mysql2', '@node-rs/argon2', 'archiver', 'flexsearch', 'nodemailer'],
  poweredByHeader: false,
  reactStrictMode: true,
};

export default nextConfig;
