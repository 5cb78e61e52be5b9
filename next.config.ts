import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  // The test command builds into its own folder so it can run beside a running start command.
  distDir: process.env.NEXT_DIST_DIR ?? ".next",
  poweredByHeader: false,
  // The test command type-checks the whole tree with tsc once; the build need not do it again.
  typescript: { ignoreBuildErrors: true },
  reactStrictMode: true,
  serverExternalPackages: ["@node-rs/argon2", "s3rver", "maildev", "pdfkit"],
};

export default nextConfig;
