import type { Db } from "@/db/client";
import type { MailEvent } from "@/lib/mail/events";
import type { MyWorkItem } from "@/emails/my-work";
import type { Props as DigestProps } from "@/emails/fleet-digest";
import type { Props as DriftProps } from "@/emails/drift-alert";
import type { Props as CalibrationProps } from "@/emails/calibration-due";
import type { Props as OverdueProps } from "@/emails/overdue-work";

/*
 * Where each message kind's data comes from. The fleet registry exists now; runs, drift,
 * instruments and work orders arrive with their own modules, which plug in here by setting a
 * loader or pushing a source (from a module imported by lib/jobs/tick-steps.ts). Until then the
 * messages say "not tracked yet" instead of showing numbers that do not exist.
 */

export type Recipient = { id: string; email: string; name: string | null; timeZone: string };
type Ctx = { db: Db; now: Date; recipient: Recipient };

type DigestSection<K extends "runsOutOfWindow" | "overdueWork" | "pmCompliance"> = (ctx: Ctx) => Promise<Exclude<DigestProps[K], { tracked: false }>>;

export const FLEET_DIGEST_SECTIONS: {
  runsOutOfWindow?: DigestSection<"runsOutOfWindow">;
  overdueWork?: DigestSection<"overdueWork">;
  pmCompliance?: DigestSection<"pmCompliance">;
} = {};

/** The work orders assigned to a person that are due today or overdue (from the work-order module). */
export const MY_WORK_SOURCE: { load?: (ctx: Ctx) => Promise<MyWorkItem[]> } = {};

type WithoutLinks<P> = Omit<P, "links" | "recipientName">;
export type EventSource<P> = (ctx: { db: Db; now: Date }) => Promise<MailEvent<WithoutLinks<P>>[]>;

/** Event-driven kinds: each source reports its events; subscriptions decide who gets them. */
export const MAIL_EVENT_SOURCES: {
  drift_alert: EventSource<DriftProps>[];
  calibration_due: EventSource<CalibrationProps>[];
  overdue_work: EventSource<OverdueProps>[];
} = { drift_alert: [], calibration_due: [], overdue_work: [] };
