/**
 * Headers on every response, the app's (next.config.ts) and the lean API server's (src/server/api-server.ts)
 * alike; each page's content security policy (with its nonce) is set in src/proxy.ts.
 */
export const securityHeaders: readonly { key: string; value: string }[] = [
  { key: "X-Content-Type-Options", value: "nosniff" },
  // Reset and invitation links carry their token in the path: never send it to another site.
  { key: "Referrer-Policy", value: "same-origin" },
  { key: "X-Frame-Options", value: "DENY" },
  { key: "Permissions-Policy", value: "camera=(), microphone=(), geolocation=(), payment=()" },
];
