"use client";
import Link from "next/link";
import { useState } from "react";
import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { createColumnHelper, rowPaginationFeature, rowSortingFeature, tableFeatures, useTable, type PaginationState, type SortingState } from "@tanstack/react-table";
import type { RunListResponse } from "@/app/api/v1/runs/route";
import type { RunListItemJson } from "@/db/queries/run-list";
import { VerdictBadge } from "./verdict-badge";
import { CalibrationBadge } from "./calibration-badge";
import { fmt } from "@/lib/runs/format";

const features = tableFeatures({ rowSortingFeature, rowPaginationFeature });
const helper = createColumnHelper<typeof features, RunListItemJson>();
const SORTABLE = new Set(["runAt", "deltaTPeak", "windowUse", "peakMin", "criticalSpread", "talMin"]);
const num = (v: number | null, d = 1) => <span className="num">{fmt(v, d)}</span>;

function columnsFor(timeZone: string, showOven: boolean) {
  const when = new Intl.DateTimeFormat("en-GB", { timeZone, day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit" });
  return helper.columns([
    helper.accessor("runAt", { header: "When", cell: (c) => <Link className="font-medium underline decoration-paper-line underline-offset-4 hover:decoration-ember" href={`/runs/${c.row.original.id}`}>{when.format(new Date(c.getValue()))}</Link> }),
    ...(showOven ? [helper.accessor("ovenTag", { header: "Oven", enableSorting: false })] : []),
    helper.accessor("verdict", { header: "Verdict", enableSorting: false, cell: (c) => <VerdictBadge status={c.getValue()} /> }),
    helper.accessor("windowUse", { header: "Window use %", cell: (c) => num(c.getValue(), 0) }),
    helper.accessor("deltaTPeak", { header: "ΔT °C", cell: (c) => num(c.getValue()) }),
    helper.accessor("criticalSpread", { header: "Critical spread °C", cell: (c) => num(c.getValue()) }),
    helper.accessor("peakMin", { header: "Coldest peak °C", cell: (c) => num(c.getValue()) }),
    helper.accessor("talMin", { header: "Shortest TAL s", cell: (c) => num(c.getValue(), 0) }),
    helper.accessor("instrumentName", { header: "Instrument", enableSorting: false, cell: (c) => c.getValue() ?? "—" }),
    helper.accessor("calibration", { header: "Calibration", enableSorting: false, cell: (c) => (c.getValue() === "valid" ? <span className="text-xs text-ink-muted">valid</span> : <CalibrationBadge state={c.getValue()} label={c.getValue() === "lapsed" ? "lapsed" : "none"} />) }),
  ]);
}

type Option = { id: number; label: string };
export type RunsTableProps = { timeZone: string; ovenId?: number; ovens?: Option[]; windows: Option[]; instruments: Option[]; initial?: RunListResponse };

function toQuery(p: { ovenId?: string; from: string; to: string; verdict: string; windowId: string; instrumentId: string }, paging?: { pagination: PaginationState; sorting: SortingState }) {
  const q = new URLSearchParams();
  for (const [k, v] of Object.entries(p)) if (v) q.set(k, v);
  if (paging) {
    q.set("page", String(paging.pagination.pageIndex + 1));
    q.set("pageSize", String(paging.pagination.pageSize));
    const s = paging.sorting[0];
    if (s) q.set("sort", `${s.desc ? "-" : ""}${s.id}`);
  }
  return q.toString();
}

/** Runs with server-side paging, sorting and filters through GET /api/v1/runs. */
export function RunsTable({ timeZone, ovenId, ovens, windows, instruments, initial }: RunsTableProps) {
  const [filters, setFilters] = useState({ ovenId: ovenId ? String(ovenId) : "", from: "", to: "", verdict: "", windowId: "", instrumentId: "" });
  const [sorting, setSorting] = useState<SortingState>([{ id: "runAt", desc: true }]);
  const [pagination, setPagination] = useState<PaginationState>({ pageIndex: 0, pageSize: 25 });
  const query = toQuery(filters, { pagination, sorting });
  const isInitial = query === toQuery({ ...filters, from: "", to: "", verdict: "", windowId: "", instrumentId: "" }, { pagination: { pageIndex: 0, pageSize: 25 }, sorting: [{ id: "runAt", desc: true }] });
  const result = useQuery({
    queryKey: ["runs", query],
    queryFn: async () => {
      const res = await fetch(`/api/v1/runs?${query}`);
      if (!res.ok) throw new Error(((await res.json()) as { error?: { message?: string } }).error?.message ?? "The runs could not be loaded.");
      return (await res.json()) as RunListResponse;
    },
    initialData: isInitial ? initial : undefined,
    placeholderData: keepPreviousData,
  });
  const [columns] = useState(() => columnsFor(timeZone, !ovenId));
  const [empty] = useState<RunListItemJson[]>([]);
  const table = useTable({
    features, columns, data: result.data?.items ?? empty, rowCount: result.data?.total ?? 0,
    state: { sorting, pagination }, onSortingChange: setSorting, onPaginationChange: setPagination,
    manualSorting: true, manualPagination: true, enableSortingRemoval: false,
  });
  const set = (k: keyof typeof filters) => (e: { target: { value: string } }) => {
    setFilters((f) => ({ ...f, [k]: e.target.value }));
    setPagination((p) => ({ ...p, pageIndex: 0 }));
  };
  const total = result.data?.total ?? 0;
  const pages = Math.max(1, Math.ceil(total / pagination.pageSize));
  const control = "min-h-11 w-full rounded-lg border border-paper-line bg-paper-raised px-2 text-sm";
  return (
    <section className="space-y-3" aria-label="Runs">
      <form className="grid grid-cols-2 gap-2 md:grid-cols-4 lg:grid-cols-7" onSubmit={(e) => e.preventDefault()} aria-label="Filter runs">
        {ovens ? (
          <label className="text-xs text-ink-muted">Oven<select className={control} value={filters.ovenId} onChange={set("ovenId")}><option value="">All ovens</option>{ovens.map((o) => <option key={o.id} value={o.id}>{o.label}</option>)}</select></label>
        ) : null}
        <label className="text-xs text-ink-muted">From<input type="date" className={control} value={filters.from} onChange={set("from")} /></label>
        <label className="text-xs text-ink-muted">To<input type="date" className={control} value={filters.to} onChange={set("to")} /></label>
        <label className="text-xs text-ink-muted">Verdict<select className={control} value={filters.verdict} onChange={set("verdict")}><option value="">Any</option><option value="pass">In window</option><option value="marginal">Near the edge</option><option value="fail">Out of window</option></select></label>
        <label className="text-xs text-ink-muted">Window<select className={control} value={filters.windowId} onChange={set("windowId")}><option value="">Any</option>{windows.map((o) => <option key={o.id} value={o.id}>{o.label}</option>)}</select></label>
        <label className="text-xs text-ink-muted">Instrument<select className={control} value={filters.instrumentId} onChange={set("instrumentId")}><option value="">Any</option>{instruments.map((o) => <option key={o.id} value={o.id}>{o.label}</option>)}</select></label>
        <div className="flex items-end"><a className="inline-flex min-h-11 w-full items-center justify-center rounded-lg border border-paper-line bg-paper-raised px-3 text-sm font-semibold hover:bg-paper-sunk" href={`/api/v1/runs/export.csv?${toQuery(filters)}`}>Export CSV</a></div>
      </form>
      {result.error ? <p role="alert" className="text-sm text-health-act">{(result.error as Error).message}</p> : null}
      <div className="md:hidden">
        <label className="text-xs text-ink-muted">Sort by
          <select className={control} value={`${sorting[0]?.desc ? "-" : ""}${sorting[0]?.id ?? "runAt"}`} onChange={(e) => { const v = e.target.value; setSorting([{ id: v.replace(/^-/, ""), desc: v.startsWith("-") }]); setPagination((p) => ({ ...p, pageIndex: 0 })); }}>
            <option value="-runAt">Newest first</option>
            <option value="runAt">Oldest first</option>
            <option value="-deltaTPeak">Largest ΔT first</option>
            <option value="-windowUse">Most window used first</option>
            <option value="-criticalSpread">Largest critical spread first</option>
            <option value="talMin">Shortest TAL first</option>
          </select>
        </label>
        <ul className={`mt-2 space-y-2 ${result.isFetching ? "opacity-60" : ""}`} aria-label="Runs">
          {(result.data?.items ?? []).map((r) => (
            <li key={r.id}>
              <Link href={`/runs/${r.id}`} className="card flex min-h-11 flex-col gap-1 p-3">
                <span className="flex items-center justify-between gap-2">
                  <span className="font-medium">{ovenId ? "" : `${r.ovenTag} · `}{new Intl.DateTimeFormat("en-GB", { timeZone, day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit" }).format(new Date(r.runAt))}</span>
                  <VerdictBadge status={r.verdict} />
                </span>
                <span className="text-sm text-ink-soft">
                  ΔT <span className="num">{fmt(r.deltaTPeak)}</span> <span className="unit">°C</span> · window use <span className="num">{fmt(r.windowUse, 0)}</span> % · TAL <span className="num">{fmt(r.talMin, 0)}</span> <span className="unit">s</span>
                  {r.calibration === "lapsed" ? <> · <CalibrationBadge state="lapsed" label="calibration lapsed" /></> : null}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      </div>
      <div className="card hidden overflow-x-auto md:block" tabIndex={0} role="region" aria-label="Runs table">
        <table className="w-full min-w-[52rem] text-sm">
          <caption className="sr-only">Verification runs, {total} in all; column headers sort</caption>
          <thead className="text-left text-xs text-ink-muted">
            {table.getHeaderGroups().map((g) => (
              <tr key={g.id}>
                {g.headers.map((h) => {
                  const sortable = SORTABLE.has(h.column.id);
                  const dir = h.column.getIsSorted();
                  return (
                    <th key={h.id} scope="col" aria-sort={dir === "asc" ? "ascending" : dir === "desc" ? "descending" : undefined} className="px-3 py-2 font-medium">
                      {sortable ? (
                        <button type="button" className="inline-flex min-h-9 items-center gap-1 hover:text-ink" onClick={h.column.getToggleSortingHandler()}>
                          <table.FlexRender header={h} />
                          <span aria-hidden="true">{dir === "asc" ? "▲" : dir === "desc" ? "▼" : "↕"}</span>
                        </button>
                      ) : (
                        <table.FlexRender header={h} />
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody className={result.isFetching ? "opacity-60" : ""}>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="border-t border-paper-line">
                {row.getAllCells().map((cell) => (
                  <td key={cell.id} className="whitespace-nowrap px-3 py-2 text-right first:text-left [&:nth-child(2)]:text-left">
                    <table.FlexRender cell={cell} />
                  </td>
                ))}
              </tr>
            ))}
            {!result.isFetching && total === 0 ? (
              <tr><td colSpan={columns.length} className="px-3 py-6 text-center text-ink-muted">No runs match these filters.</td></tr>
            ) : null}
          </tbody>
        </table>
      </div>
      <nav className="flex flex-wrap items-center justify-between gap-2 text-sm" aria-label="Pages">
        <p className="text-ink-muted"><span className="num">{total}</span> runs · page <span className="num">{pagination.pageIndex + 1}</span> of <span className="num">{pages}</span></p>
        <div className="flex gap-2">
          <button type="button" className="min-h-11 rounded-lg border border-paper-line px-3 disabled:opacity-40" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>Previous</button>
          <button type="button" className="min-h-11 rounded-lg border border-paper-line px-3 disabled:opacity-40" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>Next</button>
        </div>
      </nav>
    </section>
  );
}
