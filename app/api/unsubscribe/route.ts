import { NextResponse } from "next/server";
import { getDb } from "@/db";
import { errorResponse } from "@/lib/api";
import { AppError } from "@/lib/errors";
import { unsubscribeWithToken } from "@/lib/unsubscribe";

export const dynamic = "force-dynamic";

/*
 * RFC 8058 one-click unsubscribe. Mail clients POST "List-Unsubscribe=One-Click" to the URL in
 * the List-Unsubscribe header (/unsubscribe?token=…; proxy.ts hands that POST to this route).
 * The signed token is the only credential. The confirmation page's button posts here too and
 * is sent back to the page, which then says it is done.
 */
export const POST = withSignedToken(async (req, token) => {
  const done = await unsubscribeWithToken(await getDb(), token);
  const form = await req.formData().catch(() => null);
  if (form?.get("from") === "page") {
    return NextResponse.redirect(new URL(`/unsubscribe?token=${encodeURIComponent(token)}`, req.url), 303);
  }
  return NextResponse.json({ unsubscribed: true, kind: done.kind });
});

function withSignedToken(handler: (req: Request, token: string) => Promise<Response>) {
  const route = async (req: Request) => {
    const token = new URL(req.url).searchParams.get("token");
    try {
      if (!token) throw new AppError("invalid_input", "The unsubscribe link has no token. Copy the whole link from the e-mail.", { fields: { token: "is required" } });
      return await handler(req, token);
    } catch (err) {
      if (err instanceof AppError) return errorResponse(err);
      console.error("[unsubscribe]", err);
      return errorResponse(new AppError("internal", "Something went wrong on the server. It has been logged; try again."));
    }
  };
  Object.assign(route, { permission: "signed-token" });
  return route;
}
