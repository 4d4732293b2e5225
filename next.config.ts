import type { NextConfig } from "next";
import { STATIC_SECURITY_HEADERS } from "./lib/security-headers";

const nextConfig: NextConfig = {
  serverExternalPackages: ["pg", "pg-boss", "nodemailer", "smtp-server", "mailparser"],
  experimental: { authInterrupts: true },
  poweredByHeader: false,
  // The per-request content security policy and HSTS come from proxy.ts.
  headers: async () => [{ source: "/:path*", headers: [...STATIC_SECURITY_HEADERS] }],
  // The build checks the app's own code; `npm test` type-checks everything, tests included (tsc --noEmit).
  typescript: { tsconfigPath: "tsconfig.build.json" },
};

export default nextConfig;
