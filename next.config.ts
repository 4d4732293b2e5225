import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  serverExternalPackages: ["pg", "pg-boss", "nodemailer", "smtp-server", "mailparser"],
  experimental: { authInterrupts: true },
  poweredByHeader: false,
  // The build checks the app's own code; `npm test` type-checks everything, tests included (tsc --noEmit).
  typescript: { tsconfigPath: "tsconfig.build.json" },
};

export default nextConfig;
