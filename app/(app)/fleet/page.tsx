import Link from "next/link";
import { getDb } from "@/db";
import { listOvens, type OvenListRow } from "@/db/queries/ovens";
import { listSitesWithLines } from "@/db/queries/sites";
import { PageHeader } from "@/components/ui/page-header";
import { EmptyState } from "@/components/ui/empty-state";
import { buttonClass } from "@/components/ui/button";
import { ServiceStateBadge } from "@/components/oven/service-state-badge";
import { requirePermission } from "@/lib/session";
import { can } from "@/lib/permissions";
import { fleetFilterSchema, OVEN_KIND_LABELS, SERVICE_STATE_LABELS, SERVICE_STATE_VALUES } from "@/lib/validation/oven";
import { FleetFilters } from "./fleet-filters";

export const metadata = { title: "Fleet" };

function groupByLine(rows: OvenListRow[]) {
  const groups = new Map<string, { site: string; line: string; ovens: OvenListRow[] }>();
  for (const r of rows) {
    const key = `${r.site.id}:${r.line.id}`;
    if (!groups.has(key)) groups.set(key, { site: r.site.name, line: r.line.name, ovens: [] });
    groups.get(key)!.ovens.push(r);
  }
  return [...groups.values()];
}

export default async function FleetPage({ searchParams }: { searchParams: Promise<Record<string, string>> }) {
  const actor = await requirePermission("fleet.read");
  const parsed = fleetFilterSchema.safeParse(await searchParams);
  const filter = parsed.success ? parsed.data : {};
  const db = await getDb();
  const [rows, sites, all] = await Promise.all([listOvens(db, filter), listSitesWithLines(db), listOvens(db)]);
  const counts = Object.fromEntries(SERVICE_STATE_VALUES.map((s) => [s, all.filter((r) => r.oven.serviceState === s).length]));
  const groups = groupByLine(rows);
  return (
    <>
      <PageHeader
        title="Fleet"
        subtitle={`${all.length} ovens · ${counts.in_service} in service · ${counts.down} down · ${counts.retired} retired`}
        actions={can(actor.role, "oven.create") ? <Link href="/ovens/new" className={buttonClass("primary")}>Add an oven</Link> : null}
      />
      <FleetFilters sites={sites} filter={filter} />
      {groups.length === 0 ? (
        <EmptyState title={all.length ? "No oven matches these filters" : "No ovens yet"}>
          {all.length ? "Clear a filter to see more of the fleet." : "An engineer adds each oven with its tag, kind and line. Its runs and maintenance then collect on its page."}
        </EmptyState>
      ) : (
        <div className="space-y-8">
          {groups.map((g) => (
            <section key={`${g.site}-${g.line}`} aria-labelledby={`line-${g.line}`}>
              <h2 id={`line-${g.line}`} className="mb-2 text-sm font-semibold uppercase tracking-wider text-ink-muted">
                {g.line} <span className="font-normal normal-case tracking-normal">· {g.site}</span>
              </h2>
              <ul className="grid gap-2">
                {g.ovens.map(({ oven }) => (
                  <li key={oven.id}>
                    <Link
                      href={`/ovens/${oven.id}`}
                      className="card flex flex-col gap-1 p-4 hover:border-ember-ring sm:grid sm:grid-cols-[8rem_1fr_12rem_8rem] sm:items-center sm:gap-4"
                    >
                      <span className="flex items-center justify-between gap-2">
                        <span className="text-lg font-semibold tracking-wide">{oven.tag}</span>
                        <span className="sm:hidden">
                          <ServiceStateBadge state={oven.serviceState} />
                        </span>
                      </span>
                      <span className="min-w-0">
                        <span className="block truncate font-medium">{oven.name}</span>
                        <span className="block text-sm text-ink-muted">
                          {OVEN_KIND_LABELS[oven.kind]}
                          {oven.zones && oven.kind === "convection" ? `, ${oven.zones} zones` : ""}
                        </span>
                      </span>
                      <span className="text-sm text-ink-muted">{[oven.maker, oven.model].filter(Boolean).join(" ") || "Maker not recorded"}</span>
                      <span className="hidden sm:block">
                        <ServiceStateBadge state={oven.serviceState} />
                      </span>
                    </Link>
                  </li>
                ))}
              </ul>
            </section>
          ))}
        </div>
      )}
      <p className="sr-only">States: {SERVICE_STATE_VALUES.map((s) => SERVICE_STATE_LABELS[s]).join(", ")}.</p>
    </>
  );
}
