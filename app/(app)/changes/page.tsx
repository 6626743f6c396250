import { getDb } from "@/db";
import { attachmentsFor, listChanges } from "@/db/queries/changes";
import { listOvens } from "@/db/queries/ovens";
import { listSitesWithLines } from "@/db/queries/sites";
import { PageHeader } from "@/components/ui/page-header";
import { EmptyState } from "@/components/ui/empty-state";
import { ChangeList } from "@/components/oven/change-list";
import { buttonClass } from "@/components/ui/button";
import { FilterSelect, filterControl } from "@/components/ui/filter-select";
import { requirePermission } from "@/lib/session";
import { CHANGE_AREA_LABELS, CHANGE_AREA_VALUES, changeFilterSchema } from "@/lib/validation/change";

export const metadata = { title: "Changes" };

export default async function ChangesPage({ searchParams }: { searchParams: Promise<Record<string, string>> }) {
  await requirePermission("change.read");
  const raw = await searchParams;
  const parsed = changeFilterSchema.safeParse(raw);
  const filter = parsed.success ? parsed.data : {};
  const db = await getDb();
  const [rows, ovens, sites] = await Promise.all([listChanges(db, filter), listOvens(db), listSitesWithLines(db)]);
  const files = await attachmentsFor(db, rows.map((r) => r.change.id));
  const tz = sites[0]?.timeZone ?? "UTC";
  return (
    <>
      <PageHeader title="Changes" subtitle="Every hardware and firmware change across the fleet, newest first." />
      <form method="get" className="no-print mb-6 flex flex-wrap items-end gap-3" aria-label="Filter the changes">
        <FilterSelect label="Oven" name="ovenId" defaultValue={raw.ovenId} anyLabel="All ovens" options={ovens.map((o) => ({ value: o.oven.id, label: o.oven.tag }))} />
        <FilterSelect label="Area" name="area" defaultValue={raw.area} anyLabel="All areas" options={CHANGE_AREA_VALUES.map((a) => ({ value: a, label: CHANGE_AREA_LABELS[a] }))} />
        <label className="flex flex-col text-xs font-medium text-ink-muted">
          From
          <input type="date" name="from" defaultValue={raw.from ?? ""} className={filterControl} />
        </label>
        <label className="flex flex-col text-xs font-medium text-ink-muted">
          To
          <input type="date" name="to" defaultValue={raw.to ?? ""} className={filterControl} />
        </label>
        <button className={buttonClass("secondary")}>Apply</button>
        <a href="/changes" className="min-h-11 px-2 py-3 text-sm text-ink-soft underline">
          Clear
        </a>
      </form>
      {rows.length ? <ChangeList rows={rows} attachments={files} timeZone={tz} showOven /> : <EmptyState title="No changes match">Clear a filter, or log a change from an oven&apos;s Changes section.</EmptyState>}
    </>
  );
}
