import { plainTextSelectors, render } from "@react-email/render";
import type { ReactElement } from "react";

/*
 * HTML and plain-text parts of a message. Tables become aligned columns in the text part
 * (html-to-text's "dataTable"), instead of one cell per line, so a digest reads well in a
 * text-only client; elements marked data-skip-in-text (e.g. "paste this address", which
 * only repeats the link) are left out of it.
 */
const TEXT_OPTIONS = {
  wordwrap: 78,
  selectors: [
    ...plainTextSelectors,
    { selector: "table.mail-data", format: "dataTable", options: { uppercaseHeaderCells: false, maxColumnWidth: 44, colSpacing: 3 } },
  ],
};

export async function renderMail(element: ReactElement): Promise<{ html: string; text: string }> {
  const [html, text] = await Promise.all([render(element), render(element, { plainText: true, htmlToTextOptions: TEXT_OPTIONS })]);
  return { html, text };
}
