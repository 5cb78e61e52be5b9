import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  // The test command builds into its own folder so it can run beside a running start command.
  distDir: process.env.NEXT_DIST_DIR ?? ".next",
  poweredByHeader: false,
  // The test command type-checks the whole tree with tsc once; the build need not do it again.
  typescript: { ignoreBuildErrors: true },
  reactStrictMode: true,
  serverExternalPackages: ["@node-rs/argon2", "s3rver", "maildev", "pdfkit", "pg-boss"],
  // Headers for every response; each page's content security policy (with its nonce) is set in src/proxy.ts.
  async headers() {
    return [
      {
        source: "/:path*",
        headers: [
          { key: "X-Content-Type-Options", value: "nosniff" },
          // Reset and invitation links carry their token in the path: never send it to another site.
          { key: "Referrer-Policy", value: "same-origin" },
          { key: "X-Frame-Options", value: "DENY" },
          { key: "Permissions-Policy", value: "camera=(), microphone=(), geolocation=(), payment=()" },
        ],
      },
    ];
  },
};

export default nextConfig;
