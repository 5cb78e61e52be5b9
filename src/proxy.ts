import { type NextRequest, NextResponse } from "next/server";
import { freshNonce } from "@/lib/nonce";

/**
 * The content security policy of every page, with a fresh nonce per request: Next.js reads the policy from the
 * request headers and puts the nonce on its own scripts, and 'strict-dynamic' lets those load the rest, so no other
 * script runs. Uploads go from the browser straight to object storage, hence its origin in connect-src. Styles stay
 * 'unsafe-inline' (React style attributes and the charts' inline styles); frames from anywhere are refused.
 */
export function contentSecurityPolicy(nonce: string, storageOrigin: string | null, dev: boolean): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' blob: data:",
    "font-src 'self'",
    `connect-src 'self'${storageOrigin ? ` ${storageOrigin}` : ""}`,
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");
}

function storageOrigin(): string | null {
  try {
    return process.env.S3_ENDPOINT ? new URL(process.env.S3_ENDPOINT).origin : null;
  } catch {
    return null;
  }
}

/** Sets the page's security policy, and passes the requested path on so a sign-in redirect can come back to it. */
export function proxy(req: NextRequest) {
  const nonce = freshNonce();
  const policy = contentSecurityPolicy(nonce, storageOrigin(), process.env.NODE_ENV === "development");
  const headers = new Headers(req.headers);
  headers.set("x-pathname", req.nextUrl.pathname + req.nextUrl.search);
  headers.set("x-nonce", nonce);
  headers.set("content-security-policy", policy);
  const response = NextResponse.next({ request: { headers } });
  response.headers.set("content-security-policy", policy);
  return response;
}

export const config = { matcher: ["/((?!api|_next|fonts|examples|favicon.ico).*)"] };
