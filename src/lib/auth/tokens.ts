import { createHash, randomBytes } from "node:crypto";

/** A random secret for a link or an API token: 32 bytes, base64url. */
export function randomToken(prefix = ""): string {
  return prefix + randomBytes(32).toString("base64url");
}

/** Tokens are stored only as their SHA-256; a stolen table gives no usable link or token. */
export function hashToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}
