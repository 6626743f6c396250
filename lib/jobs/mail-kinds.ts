import { createElement, type ReactElement } from "react";
import type { Db } from "@/db/client";
import type { MailKind } from "@/db/schema/mail";
import { listActiveSubscribers } from "@/db/queries/subscriptions";
import { eventMessages } from "@/lib/mail/events";
import { dueOccurrence } from "@/lib/mail/schedule";
import { appUrl } from "@/lib/env";
import type { MailLinks } from "@/emails/_components/subscription-footer";
import { FleetDigestEmail, type Props as DigestProps } from "@/emails/fleet-digest";
import { MyWorkEmail, type Props as MyWorkProps } from "@/emails/my-work";
import { DriftAlertEmail, type Props as DriftProps } from "@/emails/drift-alert";
import { CalibrationDueEmail, type Props as CalibrationProps } from "@/emails/calibration-due";
import { OverdueWorkEmail, type Props as OverdueProps } from "@/emails/overdue-work";
import { MAIL_EVENT_SOURCES, MY_WORK_SOURCE, type Recipient } from "./mail-sources";
import { loadFleetDigest, longDate } from "./mail-loaders";

/*
 * The registry of message kinds. Each kind says what is due now (`collect`: a data loader
 * around a pure decision) and how it looks (`render`). The tick walks this table; a new kind
 * is one more entry.
 */

export type Due<P> = {
  recipient: Recipient;
  /** Scheduled kinds: the occurrence; event kinds: the event's key. Part of the idempotency key. */
  occurrence?: Date;
  event?: string;
  subscriptionId?: number;
  props: Omit<P, "links">;
};

export type MailKindDef<P> = {
  kind: MailKind;
  collect: (db: Db, now: Date) => Promise<Due<P>[]>;
  render: (props: P) => { subject: string; element: ReactElement };
};

type Loader<P> = (ctx: { db: Db; now: Date; recipient: Recipient; occurrence: Date }) => Promise<Omit<P, "links">>;

/** Scheduled kinds: every enabled subscription whose RRULE has an occurrence due and not yet enqueued. */
function scheduled<P>(kind: MailKind, load: Loader<P>) {
  return async (db: Db, now: Date): Promise<Due<P>[]> => {
    const out: Due<P>[] = [];
    for (const { sub, user } of await listActiveSubscribers(db, kind)) {
      const occurrence = dueOccurrence({ ...sub, timeZone: user.timeZone }, now);
      if (!occurrence) continue;
      const recipient = { id: user.id, email: user.email, name: user.name, timeZone: user.timeZone };
      out.push({ recipient, occurrence, subscriptionId: sub.id, props: await load({ db, now, recipient, occurrence }) });
    }
    return out;
  };
}

/** Event kinds: the sources' events, fanned out to the subscribers they concern. */
function evented<P extends { recipientName: string }>(kind: keyof typeof MAIL_EVENT_SOURCES) {
  return async (db: Db, now: Date): Promise<Due<P>[]> => {
    const sources = MAIL_EVENT_SOURCES[kind] as unknown as ((ctx: { db: Db; now: Date }) => Promise<Parameters<typeof eventMessages<Omit<P, "links" | "recipientName">>>[0]>)[];
    if (sources.length === 0) return [];
    const events = (await Promise.all(sources.map((s) => s({ db, now })))).flat();
    const subs = await listActiveSubscribers(db, kind);
    const users = new Map(subs.map((s) => [s.user.id, s.user]));
    return eventMessages(events, subs.map((s) => ({ userId: s.user.id, enabled: s.sub.enabled }))).map((m) => {
      const u = users.get(m.userId)!;
      const recipient = { id: u.id, email: u.email, name: u.name, timeZone: u.timeZone };
      return { recipient, event: m.eventKey, props: { ...m.props, recipientName: firstName(recipient) } as unknown as Omit<P, "links"> };
    });
  };
}

export const firstName = (r: Recipient) => (r.name ?? r.email).split(/\s+/)[0];

const fleetDigest: MailKindDef<DigestProps> = {
  kind: "fleet_digest",
  collect: scheduled<DigestProps>("fleet_digest", loadFleetDigest),
  render: (p) => ({ subject: `Fleet digest, ${p.weekLabel}: ${p.ovens.filter((o) => o.state === "in_service").length} of ${p.ovens.length} ovens in service`, element: createElement(FleetDigestEmail, p) }),
};

const myWork: MailKindDef<MyWorkProps> = {
  kind: "my_work_daily",
  collect: scheduled<MyWorkProps>("my_work_daily", async ({ db, now, recipient, occurrence }) => ({
    recipientName: firstName(recipient),
    dateLabel: longDate(occurrence, recipient.timeZone),
    items: MY_WORK_SOURCE.load ? await MY_WORK_SOURCE.load({ db, now, recipient }) : null,
    myWorkUrl: `${appUrl()}/my-work`,
  })),
  render: (p) => {
    const n = p.items?.length ?? 0;
    const count = p.items === null ? "" : n ? `: ${n} work order${n === 1 ? "" : "s"}` : ": nothing due";
    return { subject: `My work for ${p.dateLabel}${count}`, element: createElement(MyWorkEmail, p) };
  },
};

const driftAlert: MailKindDef<DriftProps> = {
  kind: "drift_alert",
  collect: evented<DriftProps & { recipientName: string }>("drift_alert"),
  render: (p) => ({ subject: `${p.ovenTag}: ${p.health === "act" ? "Act" : "Watch"} — ${p.metric}`, element: createElement(DriftAlertEmail, p) }),
};

const calibrationDue: MailKindDef<CalibrationProps> = {
  kind: "calibration_due",
  collect: evented<CalibrationProps & { recipientName: string }>("calibration_due"),
  render: (p) => ({ subject: `Calibration of ${p.instrument} lapses in ${p.daysLeft} day${p.daysLeft === 1 ? "" : "s"}`, element: createElement(CalibrationDueEmail, p) }),
};

const overdueWork: MailKindDef<OverdueProps> = {
  kind: "overdue_work",
  collect: evented<OverdueProps>("overdue_work"),
  render: (p) => ({ subject: `${p.orders.length} overdue work order${p.orders.length === 1 ? "" : "s"}${p.as === "manager" ? " in your team" : ""}`, element: createElement(OverdueWorkEmail, p) }),
};

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export const MAIL_KIND_REGISTRY: MailKindDef<any>[] = [fleetDigest, myWork, driftAlert, calibrationDue, overdueWork];

export type { MailLinks };
