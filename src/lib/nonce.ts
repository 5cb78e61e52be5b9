/** A fresh content-security-policy nonce: a random UUID in base64 (122 random bits, 48 characters). */
export function freshNonce(): string {
  return Buffer.from(crypto.randomUUID()).toString("base64");
}
