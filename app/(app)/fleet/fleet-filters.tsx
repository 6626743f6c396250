import type { SiteWithLines } from "@/db/queries/sites";
import type { FleetFilter } from "@/lib/validation/oven";
import { SERVICE_STATE_LABELS, SERVICE_STATE_VALUES } from "@/lib/validation/oven";
import { buttonClass } from "@/components/ui/button";

// A plain GET form: filters live in the address, so a filtered view can be bookmarked or shared.
export function FleetFilters({ sites, filter }: { sites: SiteWithLines[]; filter: FleetFilter }) {
  const select = "min-h-11 rounded-lg border border-paper-line bg-paper-raised px-3 text-sm";
  return (
    <form method="get" className="no-print mb-6 flex flex-wrap items-end gap-3" aria-label="Filter the fleet">
      <label className="flex flex-col text-xs font-medium text-ink-muted">
        Site
        <select name="siteId" defaultValue={filter.siteId ?? ""} className={select}>
          <option value="">All sites</option>
          {sites.map((s) => (
            <option key={s.id} value={s.id}>
              {s.name}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col text-xs font-medium text-ink-muted">
        Line
        <select name="lineId" defaultValue={filter.lineId ?? ""} className={select}>
          <option value="">All lines</option>
          {sites.flatMap((s) =>
            s.lines.map((l) => (
              <option key={l.id} value={l.id}>
                {l.name}
              </option>
            )),
          )}
        </select>
      </label>
      <label className="flex flex-col text-xs font-medium text-ink-muted">
        Service state
        <select name="state" defaultValue={filter.state ?? ""} className={select}>
          <option value="">Any</option>
          {SERVICE_STATE_VALUES.map((s) => (
            <option key={s} value={s}>
              {SERVICE_STATE_LABELS[s]}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col text-xs font-medium text-ink-muted">
        Tag or name
        <input name="q" defaultValue={filter.q ?? ""} className={select} placeholder="e.g. L2" />
      </label>
      <button className={buttonClass("secondary")}>Apply</button>
      <a href="/fleet" className="min-h-11 px-2 py-3 text-sm text-ink-soft underline">
        Clear
      </a>
    </form>
  );
}
