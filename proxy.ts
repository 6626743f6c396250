import { NextResponse, type NextRequest } from "next/server";

// The proxy only sends signed-out visitors to the sign-in page. It is not a permission check:
// every page, action and route handler checks the role itself on the server.
// The mail preview is a route handler that answers 401/403 itself (withApi).
const PUBLIC = ["/sign-in", "/invite", "/unsubscribe", "/dev/mail/preview/", "/_next/", "/favicon.svg"];

export function proxy(req: NextRequest) {
  const { pathname, search } = req.nextUrl;
  // RFC 8058: mail clients POST to the List-Unsubscribe URL itself. That URL is the public
  // confirmation page, so its POSTs (other than the page's own server actions) go to the route.
  if (pathname === "/unsubscribe" && req.method === "POST" && !req.headers.get("next-action")) {
    const url = req.nextUrl.clone();
    url.pathname = "/api/unsubscribe";
    return NextResponse.rewrite(url);
  }
  if (PUBLIC.some((p) => pathname.startsWith(p))) return NextResponse.next();
  const hasSession = req.cookies.getAll().some((c) => c.name.endsWith("authjs.session-token"));
  if (hasSession) return NextResponse.next();
  const url = req.nextUrl.clone();
  url.pathname = "/sign-in";
  url.search = pathname === "/" ? "" : `?next=${encodeURIComponent(pathname + search)}`;
  return NextResponse.redirect(url);
}

// Route handlers under /api answer 401 themselves, and a proxy in front of them would buffer
// (and cut at its body limit) every upload: the matcher leaves them out.
export const config = { matcher: ["/((?!api/|_next/static|_next/image).*)"] };
