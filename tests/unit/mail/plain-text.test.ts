import { createElement, type ComponentType } from "react";
import { describe, expect, it } from "vitest";
import { renderMail } from "@/lib/mail-render";
import * as digest from "@/emails/fleet-digest";
import * as myWork from "@/emails/my-work";
import * as drift from "@/emails/drift-alert";
import * as calibration from "@/emails/calibration-due";
import * as overdue from "@/emails/overdue-work";
import * as magic from "@/emails/magic-link";
import * as invitation from "@/emails/invitation";

// The text part is what text-only clients, screen readers and spam filters see: it must carry
// every link of the HTML part, keep table rows on one line, and contain no markup.
type Mod = { default: ComponentType<never>; PreviewProps: object };
const TEMPLATES: Record<string, Mod> = { digest, myWork, drift, calibration, overdue, magic, invitation } as unknown as Record<string, Mod>;
const SUBSCRIBED = ["digest", "myWork", "drift", "calibration", "overdue"];

const render = (m: Mod, props: object = m.PreviewProps) => renderMail(createElement(m.default as ComponentType<object>, props));

describe.each(Object.keys(TEMPLATES))("%s", (name) => {
  it("has a text part with every link, no markup and no runs of blank lines", async () => {
    const { html, text } = await render(TEMPLATES[name]);
    const hrefs = [...html.matchAll(/href="([^"]+)"/g)].map((m) => m[1].replace(/&amp;/g, "&"));
    expect(hrefs.length).toBeGreaterThan(0);
    for (const h of hrefs) expect(text).toContain(h);
    expect(text).not.toMatch(/<\/?[a-z][^>]*>/i);
    expect(text).not.toMatch(/\n\s*\n\s*\n/);
    expect(text.startsWith("▲ Ovenward")).toBe(true);
    if (SUBSCRIBED.includes(name)) {
      expect(text).toContain("http://localhost:3000/settings/notifications");
      expect(text).toContain("http://localhost:3000/unsubscribe?token=sample");
    }
  });
});

describe("text parts read well", () => {
  it("the digest's state table keeps each row on one line; absent data says 'Not tracked yet', never a number", async () => {
    const { text } = await render(TEMPLATES.digest);
    expect(text).toMatch(/^● In service\s+4$/m);
    expect(text).toMatch(/^□ Down\s+1$/m);
    expect(text).toMatch(/Runs out of window\n\nNot tracked yet — verification runs are not recorded/);
    expect(text).toMatch(/PM compliance\n\nNot tracked yet/);
  });
  it("My work without a source, and with nothing due, says so in a sentence", async () => {
    const none = (await render(TEMPLATES.myWork, { ...myWork.PreviewProps, items: null })).text.replace(/\s+/g, " ");
    expect(none).toContain("Work orders are not kept in Ovenward yet, so there is nothing to list for you today.");
    const empty = (await render(TEMPLATES.myWork, { ...myWork.PreviewProps, items: [] })).text.replace(/\s+/g, " ");
    expect(empty).toContain("Nothing is assigned to you for today, and nothing of yours is overdue.");
    expect(empty).not.toContain("Lock out before you start");
  });
  it("My work lists overdue work first, with the lock-out caution", async () => {
    const { text } = await render(TEMPLATES.myWork);
    expect(text.indexOf("L2-RF1")).toBeLessThan(text.indexOf("L1-RF1"));
    expect(text).toMatch(/^L2-RF1\s+Investigate critical-phase spread rise\s+Overdue — Fri 4 Dec, 16:00$/m);
    expect(text).toContain("isolate and lock out power");
  });
  it("the sign-in link appears once, not repeated by the 'paste this address' line", async () => {
    const { text } = await render(TEMPLATES.magic);
    expect(text.split("http://localhost:3000/api/auth/callback/nodemailer?token=sample").length - 1).toBe(1);
  });
});
