import type { SiteWithLines } from "@/db/queries/sites";
import type { FleetFilter } from "@/lib/validation/oven";
import { SERVICE_STATE_LABELS, SERVICE_STATE_VALUES } from "@/lib/validation/oven";
import { buttonClass } from "@/components/ui/button";
import { FilterSelect, filterControl } from "@/components/ui/filter-select";

// A plain GET form: filters live in the address, so a filtered view can be bookmarked or shared.
export function FleetFilters({ sites, filter }: { sites: SiteWithLines[]; filter: FleetFilter }) {
  return (
    <form method="get" className="no-print mb-6 flex flex-wrap items-end gap-3" aria-label="Filter the fleet">
      <FilterSelect label="Site" name="siteId" defaultValue={filter.siteId} anyLabel="All sites" options={sites.map((x) => ({ value: x.id, label: x.name }))} />
      <FilterSelect label="Line" name="lineId" defaultValue={filter.lineId} anyLabel="All lines" options={sites.flatMap((x) => x.lines.map((l) => ({ value: l.id, label: l.name })))} />
      <FilterSelect label="Service state" name="state" defaultValue={filter.state} anyLabel="Any" options={SERVICE_STATE_VALUES.map((x) => ({ value: x, label: SERVICE_STATE_LABELS[x] }))} />
      <label className="flex flex-col text-xs font-medium text-ink-muted">
        Tag or name
        <input name="q" defaultValue={filter.q ?? ""} className={filterControl} placeholder="e.g. L2" />
      </label>
      <button className={buttonClass("secondary")}>Apply</button>
      <a href="/fleet" className="min-h-11 px-2 py-3 text-sm text-ink-soft underline">
        Clear
      </a>
    </form>
  );
}
