/** @type {import('next').NextConfig} */
const nextConfig = {
  serverExternalPackages: ["knex", "mysql2", "pdfkit", "bcryptjs", "nodemailer", "smtp-server"],
  poweredByHeader: false,
  experimental: { authInterrupts: true },
};
export default nextConfig;
