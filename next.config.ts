import type { NextConfig } from "next";
import { securityHeaders } from "./src/lib/security-headers";

const nextConfig: NextConfig = {
  // The test command builds into its own folder so it can run beside a running start command.
  distDir: process.env.NEXT_DIST_DIR ?? ".next",
  poweredByHeader: false,
  // The test command type-checks the whole tree with tsc once; the build need not do it again.
  typescript: { ignoreBuildErrors: true },
  reactStrictMode: true,
  serverExternalPackages: ["@node-rs/argon2", "s3rver", "maildev", "pdfkit", "pg-boss"],
  // Behind the local nginx (scripts/services.sh), nginx compresses: the app's processes keep their CPU for pages.
  compress: process.env.PF_COMPRESS_AT_PROXY !== "1",
  async headers() {
    return [{ source: "/:path*", headers: [...securityHeaders] }];
  },
};

export default nextConfig;
