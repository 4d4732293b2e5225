import type { NextConfig } from "next";
import { STATIC_SECURITY_HEADERS } from "./lib/security-headers";
import { ACTION_BODY_MAX_BYTES } from "./lib/size-limits";

const nextConfig: NextConfig = {
  serverExternalPackages: ["pg", "pg-boss", "nodemailer", "smtp-server", "mailparser"],
  experimental: {
    authInterrupts: true,
    // Form posts carry at most a model document (lib/size-limits.ts); the default 1 MB would cut larger ones off.
    serverActions: { bodySizeLimit: ACTION_BODY_MAX_BYTES },
  },
  poweredByHeader: false,
  // The per-request content security policy and HSTS come from proxy.ts.
  headers: async () => [{ source: "/:path*", headers: [...STATIC_SECURITY_HEADERS] }],
  // The build checks the app's own code; `npm test` type-checks everything, tests included (tsc --noEmit).
  typescript: { tsconfigPath: "tsconfig.build.json" },
};

export default nextConfig;
