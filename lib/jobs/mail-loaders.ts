import "server-only";
import { TZDate } from "@date-fns/tz";
import { format } from "date-fns";
import { asc, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { lines, ovens, sites } from "@/db/schema/fleet";
import { appUrl } from "@/lib/env";
import type { Props as DigestProps } from "@/emails/fleet-digest";
import { FLEET_DIGEST_SECTIONS, type Recipient } from "./mail-sources";

/** "Monday 7 December 2026" on the recipient's clock. */
export function longDate(at: Date, timeZone: string): string {
  return format(new TZDate(at.getTime(), timeZone), "EEEE d MMMM yyyy");
}

/** The weekly digest's data: the registry now, other sections from their modules once they exist. */
export async function loadFleetDigest({ db, now, recipient, occurrence }: { db: Db; now: Date; recipient: Recipient; occurrence: Date }): Promise<Omit<DigestProps, "links">> {
  const rows = await db
    .select({ tag: ovens.tag, name: ovens.name, state: ovens.serviceState, line: lines.name, site: sites.name })
    .from(ovens)
    .innerJoin(lines, eq(lines.id, ovens.lineId))
    .innerJoin(sites, eq(sites.id, lines.siteId))
    .orderBy(asc(ovens.tag));
  const siteNames = [...new Set(rows.map((r) => r.site))];
  const ctx = { db, now, recipient };
  const s = FLEET_DIGEST_SECTIONS;
  return {
    recipientName: (recipient.name ?? recipient.email).split(/\s+/)[0],
    siteName: siteNames.length === 1 ? siteNames[0] : `${siteNames.length} sites`,
    weekLabel: `week of ${format(new TZDate(occurrence.getTime(), recipient.timeZone), "d MMMM yyyy")}`,
    ovens: rows.map(({ tag, name, state, line }) => ({ tag, name, state, line })),
    runsOutOfWindow: s.runsOutOfWindow ? await s.runsOutOfWindow(ctx) : { tracked: false, why: "verification runs are not recorded in Ovenward yet." },
    overdueWork: s.overdueWork ? await s.overdueWork(ctx) : { tracked: false, why: "work orders are not kept in Ovenward yet." },
    pmCompliance: s.pmCompliance ? await s.pmCompliance(ctx) : { tracked: false, why: "maintenance plans are not kept in Ovenward yet." },
    fleetUrl: `${appUrl()}/fleet`,
  };
}
