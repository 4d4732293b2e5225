import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  serverExternalPackages: ["pg", "pg-boss", "nodemailer", "smtp-server", "mailparser"],
  experimental: { authInterrupts: true },
  poweredByHeader: false,
};

export default nextConfig;
