import Link from "next/link";
import { getDb } from "@/db";
import { listSubscriptionsFor } from "@/db/queries/subscriptions";
import { getUserById, listUsers } from "@/db/queries/users";
import { PageHeader } from "@/components/ui/page-header";
import { requirePermission } from "@/lib/session";
import { can, ROLE_LABELS } from "@/lib/permissions";
import { formatDateTime } from "@/lib/format";
import { MAIL_KIND_INFO, MAIL_KIND_NAMES } from "@/lib/mail/kinds";
import { dtstartLocal, weekdaysOfRule } from "@/lib/mail/schedule";
import { nextOccurrences } from "@/lib/maintenance/recurrence";
import { SubscriptionForm, TimeZoneForm, type SubscriptionView } from "./notification-forms";

export const metadata = { title: "E-mail settings" };
export const dynamic = "force-dynamic";

const COMMON_ZONES = ["Europe/Dublin", "Europe/London", "Europe/Berlin", "Europe/Warsaw", "America/New_York", "America/Chicago", "America/Los_Angeles", "Asia/Kolkata", "Asia/Shanghai", "UTC"];

export default async function NotificationsPage({ searchParams }: { searchParams: Promise<{ user?: string }> }) {
  const actor = await requirePermission("subscription.manage.own");
  const team = can(actor.role, "subscription.manage.team");
  const db = await getDb();
  const wanted = (await searchParams).user;
  const person = (team && wanted ? await getUserById(db, wanted) : null) ?? (await getUserById(db, actor.userId))!;
  const rows = new Map((await listSubscriptionsFor(db, person.id)).map((r) => [r.kind, r]));
  const now = new Date();
  const views: SubscriptionView[] = MAIL_KIND_NAMES.map((kind) => {
    const info = MAIL_KIND_INFO[kind];
    const row = rows.get(kind);
    const sendAt = row?.sendAt ?? "07:30";
    const schedule = row?.schedule ?? null;
    const next = info.scheduled && row?.enabled && schedule ? nextOccurrences({ rrule: schedule, dtstartLocal: dtstartLocal(sendAt), timeZone: person.timeZone, after: now }, 2).map((d) => formatDateTime(d, person.timeZone)) : [];
    return { kind, label: info.label, about: info.about, scheduled: info.scheduled, enabled: row?.enabled ?? false, weekdays: weekdaysOfRule(schedule), sendAt, next };
  });
  const zones = COMMON_ZONES.includes(person.timeZone) ? COMMON_ZONES : [person.timeZone, ...COMMON_ZONES];
  const people = team ? (await listUsers(db)).filter((u) => u.active) : [];
  const self = person.id === actor.userId;
  return (
    <>
      <PageHeader
        title="E-mail settings"
        subtitle={self ? "Choose which e-mails Ovenward sends you, and when. Every e-mail also has a link to stop it." : `E-mails for ${person.name ?? person.email} (${ROLE_LABELS[person.role]}). They can change these themselves too.`}
      />
      {team ? (
        <nav aria-label="Whose e-mails" className="mb-6">
          <p className="mb-2 text-sm font-medium text-ink-soft">Manage the team&apos;s e-mails</p>
          <ul className="flex flex-wrap gap-2">
            {people.map((u) => (
              <li key={u.id}>
                <Link
                  href={u.id === actor.userId ? "/settings/notifications" : `/settings/notifications?user=${u.id}`}
                  aria-current={u.id === person.id ? "page" : undefined}
                  className={`inline-flex min-h-11 items-center rounded-lg border px-3 text-sm ${u.id === person.id ? "border-ember bg-ember-soft font-semibold text-ember-strong" : "border-paper-line bg-paper-raised"}`}
                >
                  {u.name ?? u.email}
                </Link>
              </li>
            ))}
          </ul>
        </nav>
      ) : null}
      <section className="mb-6">
        <TimeZoneForm key={person.id} userId={person.id} timeZone={person.timeZone} zones={zones} />
      </section>
      <section className="grid gap-4" aria-label="E-mails">
        {views.map((v) => (
          <SubscriptionForm key={`${person.id}-${v.kind}`} userId={person.id} timeZone={person.timeZone} sub={v} />
        ))}
      </section>
    </>
  );
}
