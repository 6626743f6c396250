import { createElement } from "react";
import { withApi } from "@/lib/api";
import { env } from "@/lib/env";
import { notFound } from "@/lib/errors";
import { renderMail } from "@/lib/mail-render";
import { MAIL_PREVIEWS } from "@/emails/_components/previews";

export const dynamic = "force-dynamic";

// Development only (the sink must be on): each template with its PreviewProps, as the HTML a
// mail client gets, or ?format=text for the plain-text part.
export const GET = withApi<{ template: string }>(
  async ({ req, params }) => {
    if (env().SMTP_SINK !== "on") throw notFound("The mail preview");
    const entry = MAIL_PREVIEWS[params.template];
    if (!entry) throw notFound(`The template “${params.template}”`);
    const { html, text } = await renderMail(createElement(entry.component, entry.props));
    const asText = new URL(req.url).searchParams.get("format") === "text";
    return new Response(asText ? text : html, { headers: { "content-type": `${asText ? "text/plain" : "text/html"}; charset=utf-8` } });
  },
  { permission: "mail.sink.read", what: "preview e-mails" },
);
