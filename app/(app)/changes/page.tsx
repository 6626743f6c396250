import { getDb } from "@/db";
import { attachmentsFor, listChanges } from "@/db/queries/changes";
import { listOvens } from "@/db/queries/ovens";
import { listSitesWithLines } from "@/db/queries/sites";
import { PageHeader } from "@/components/ui/page-header";
import { EmptyState } from "@/components/ui/empty-state";
import { ChangeList } from "@/components/oven/change-list";
import { buttonClass } from "@/components/ui/button";
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
  const select = "min-h-11 rounded-lg border border-paper-line bg-paper-raised px-3 text-sm";
  return (
    <>
      <PageHeader title="Changes" subtitle="Every hardware and firmware change across the fleet, newest first." />
      <form method="get" className="no-print mb-6 flex flex-wrap items-end gap-3" aria-label="Filter the changes">
        <label className="flex flex-col text-xs font-medium text-ink-muted">
          Oven
          <select name="ovenId" defaultValue={raw.ovenId ?? ""} className={select}>
            <option value="">All ovens</option>
            {ovens.map((o) => (
              <option key={o.oven.id} value={o.oven.id}>
                {o.oven.tag}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col text-xs font-medium text-ink-muted">
          Area
          <select name="area" defaultValue={raw.area ?? ""} className={select}>
            <option value="">All areas</option>
            {CHANGE_AREA_VALUES.map((a) => (
              <option key={a} value={a}>
                {CHANGE_AREA_LABELS[a]}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col text-xs font-medium text-ink-muted">
          From
          <input type="date" name="from" defaultValue={raw.from ?? ""} className={select} />
        </label>
        <label className="flex flex-col text-xs font-medium text-ink-muted">
          To
          <input type="date" name="to" defaultValue={raw.to ?? ""} className={select} />
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
