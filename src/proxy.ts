import { type NextRequest, NextResponse } from "next/server";

/** Passes the requested path to server components, so a sign-in redirect can come back to it. */
export function proxy(req: NextRequest) {
  const headers = new Headers(req.headers);
  headers.set("x-pathname", req.nextUrl.pathname + req.nextUrl.search);
  return NextResponse.next({ request: { headers } });
}

export const config = { matcher: ["/((?!api|_next|fonts|favicon.ico).*)"] };
