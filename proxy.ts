import { NextResponse, type NextRequest } from "next/server";

// The proxy only sends signed-out visitors to the sign-in page. It is not a permission check:
// every page, action and route handler checks the role itself on the server.
const PUBLIC = ["/sign-in", "/invite", "/unsubscribe", "/api/", "/_next/", "/favicon.svg"];

export function proxy(req: NextRequest) {
  const { pathname, search } = req.nextUrl;
  if (PUBLIC.some((p) => pathname.startsWith(p))) return NextResponse.next();
  const hasSession = req.cookies.getAll().some((c) => c.name.endsWith("authjs.session-token"));
  if (hasSession) return NextResponse.next();
  const url = req.nextUrl.clone();
  url.pathname = "/sign-in";
  url.search = pathname === "/" ? "" : `?next=${encodeURIComponent(pathname + search)}`;
  return NextResponse.redirect(url);
}

export const config = { matcher: ["/((?!_next/static|_next/image).*)"] };
