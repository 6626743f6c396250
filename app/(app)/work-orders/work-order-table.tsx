"use client";
import Link from "next/link";
import { useMemo, useState } from "react";
import { keepPreviousData, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { createColumnHelper, rowSelectionFeature, tableFeatures, useTable, type RowSelectionState } from "@tanstack/react-table";
import type { WorkOrderListResponse } from "@/app/api/v1/work-orders/route";
import type { WorkOrderListJson } from "@/db/queries/work-orders";
import { apiFetch, ApiError } from "@/components/maintenance/api-client";
import { WorkOrderStateBadge, isOverdue } from "@/components/maintenance/state-badge";
import { Button, buttonClass } from "@/components/ui/button";
import { KIND_LABELS, STATE_LABELS, WORK_ORDER_KINDS, WORK_ORDER_STATES } from "@/lib/maintenance/work-order-state";

const PAGE = 50;
const features = tableFeatures({ rowSelectionFeature });
const helper = createColumnHelper<typeof features, WorkOrderListJson>();
const emptyRows: WorkOrderListJson[] = [];
const control = "min-h-11 rounded-lg border border-paper-line bg-paper-raised px-2 text-sm";

function fmt(iso: string | null, tz: string) {
  if (!iso) return "—";
  return new Intl.DateTimeFormat("en-GB", { timeZone: tz, day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit" }).format(new Date(iso));
}

type Filters = { ovenId: string; kind: string; state: string; assigneeId: string; from: string; to: string; overdue: boolean };
const initial: Filters = { ovenId: "", kind: "", state: "unfinished", assigneeId: "", from: "", to: "", overdue: false };

function toQuery(f: Filters, offset: number) {
  const q = new URLSearchParams();
  for (const k of ["ovenId", "kind", "state", "assigneeId"] as const) if (f[k]) q.set(k, f[k]);
  // Date inputs are the viewer's local days; the API takes instants.
  if (f.from) q.set("from", new Date(`${f.from}T00:00`).toISOString());
  if (f.to) q.set("to", new Date(`${f.to}T23:59:59`).toISOString());
  if (f.overdue) q.set("overdue", "true");
  q.set("limit", String(PAGE));
  q.set("offset", String(offset));
  return q.toString();
}

export function WorkOrderTable({ ovens, people, canAssign, initialOvenId = "", initialOverdue = false }: { ovens: { id: number; tag: string }[]; people: { id: string; name: string }[]; canAssign: boolean; initialOvenId?: string; initialOverdue?: boolean }) {
  const [filters, setFilters] = useState<Filters>({ ...initial, ovenId: initialOvenId, overdue: initialOverdue });
  const [offset, setOffset] = useState(0);
  const [rowSelection, setRowSelection] = useState<RowSelectionState>({});
  const [assignee, setAssignee] = useState("");
  const [message, setMessage] = useState<string | null>(null);
  const qc = useQueryClient();
  const query = toQuery(filters, offset);
  const result = useQuery({
    queryKey: ["work-orders", query],
    queryFn: () => apiFetch<WorkOrderListResponse>(`/api/v1/work-orders?${query}`),
    placeholderData: keepPreviousData,
  });
  const now = useMemo(() => new Date(), [result.data]); // eslint-disable-line react-hooks/exhaustive-deps

  const columns = useMemo(
    () =>
      helper.columns([
        helper.display({
          id: "select",
          header: ({ table }) => (
            <input type="checkbox" aria-label="Select all on this page" className="h-5 w-5" checked={table.getIsAllRowsSelected()} onChange={() => table.toggleAllRowsSelected()} />
          ),
          cell: ({ row }) => <input type="checkbox" aria-label={`Select ${row.original.number}`} className="h-5 w-5" checked={row.getIsSelected()} onChange={() => row.toggleSelected()} />,
        }),
        helper.accessor("number", { header: "Number", cell: (c) => <Link className="whitespace-nowrap font-medium underline" href={`/work-orders/${c.row.original.id}`}>{c.getValue()}</Link> }),
        helper.accessor("ovenTag", { header: "Oven", cell: (c) => <span className="whitespace-nowrap">{c.getValue()}</span> }),
        helper.accessor("title", { header: "Task" }),
        helper.accessor("kind", { header: "Kind", cell: (c) => KIND_LABELS[c.getValue()] }),
        helper.accessor("state", { header: "State", cell: (c) => <WorkOrderStateBadge state={c.getValue()} overdue={isOverdue(c.row.original, now)} /> }),
        helper.accessor("dueAt", { header: "Due", cell: (c) => <span className="num whitespace-nowrap">{fmt(c.getValue(), c.row.original.timeZone)}</span> }),
        helper.accessor("assigneeName", { header: "Assignee", cell: (c) => c.getValue() ?? <span className="text-ink-muted">nobody</span> }),
      ]),
    [now],
  );

  const table = useTable({
    features,
    columns,
    data: result.data?.items ?? emptyRows,
    getRowId: (r) => String(r.id),
    state: { rowSelection },
    onRowSelectionChange: setRowSelection,
    enableRowSelection: canAssign,
  });

  const assign = useMutation({
    mutationFn: (ids: number[]) => apiFetch<{ assigned: number; skipped: number }>("/api/v1/work-orders/assign", { method: "POST", json: { ids, assigneeId: assignee || null } }),
    onSuccess: (r) => {
      setMessage(`${r.assigned} assigned${r.skipped ? `, ${r.skipped} skipped (already done or cancelled)` : ""}.`);
      setRowSelection({});
      qc.invalidateQueries({ queryKey: ["work-orders"] });
    },
    onError: (e) => setMessage(e instanceof ApiError ? e.message : "Could not reach the server."),
  });

  const set = (patch: Partial<Filters>) => {
    setFilters((f) => ({ ...f, ...patch }));
    setOffset(0);
    setRowSelection({});
  };
  const selected = Object.keys(rowSelection).filter((k) => rowSelection[k]).map(Number);
  const total = result.data?.total ?? 0;

  return (
    <div className="space-y-4">
      <form className="card flex flex-wrap items-end gap-3 p-3" aria-label="Filters" onSubmit={(e) => e.preventDefault()}>
        <label className="text-sm">Oven<br />
          <select className={control} value={filters.ovenId} onChange={(e) => set({ ovenId: e.target.value })}>
            <option value="">All</option>
            {ovens.map((o) => <option key={o.id} value={o.id}>{o.tag}</option>)}
          </select>
        </label>
        <label className="text-sm">Kind<br />
          <select className={control} value={filters.kind} onChange={(e) => set({ kind: e.target.value })}>
            <option value="">All</option>
            {WORK_ORDER_KINDS.map((k) => <option key={k} value={k}>{KIND_LABELS[k]}</option>)}
          </select>
        </label>
        <label className="text-sm">State<br />
          <select className={control} value={filters.state} onChange={(e) => set({ state: e.target.value })}>
            <option value="">All</option>
            <option value="unfinished">Unfinished</option>
            {WORK_ORDER_STATES.map((s) => <option key={s} value={s}>{STATE_LABELS[s]}</option>)}
          </select>
        </label>
        <label className="text-sm">Assignee<br />
          <select className={control} value={filters.assigneeId} onChange={(e) => set({ assigneeId: e.target.value })}>
            <option value="">Anyone</option>
            <option value="none">Nobody</option>
            {people.map((p) => <option key={p.id} value={p.id}>{p.name}</option>)}
          </select>
        </label>
        <label className="text-sm">Due from<br /><input type="date" className={control} value={filters.from} onChange={(e) => set({ from: e.target.value })} /></label>
        <label className="text-sm">Due to<br /><input type="date" className={control} value={filters.to} onChange={(e) => set({ to: e.target.value })} /></label>
        <label className="flex min-h-11 items-center gap-2 text-sm"><input type="checkbox" className="h-5 w-5" checked={filters.overdue} onChange={(e) => set({ overdue: e.target.checked })} /> Overdue only</label>
        <a className={buttonClass("secondary")} href={`/api/v1/work-orders/export?${toQuery(filters, 0)}`} download>Export CSV</a>
      </form>

      {canAssign ? (
        <div className="flex flex-wrap items-center gap-2" aria-label="Bulk assign">
          <span className="text-sm text-ink-muted"><span className="num">{selected.length}</span> selected</span>
          <select aria-label="Assign to" className={control} value={assignee} onChange={(e) => setAssignee(e.target.value)}>
            <option value="">Nobody (unassign)</option>
            {people.map((p) => <option key={p.id} value={p.id}>{p.name}</option>)}
          </select>
          <Button variant="primary" disabled={!selected.length || assign.isPending} onClick={() => assign.mutate(selected)}>Assign selected</Button>
          {message ? <span role="status" className="text-sm">{message}</span> : null}
        </div>
      ) : null}

      {result.error ? <p role="alert" className="text-sm text-health-act">{(result.error as Error).message}</p> : null}
      <div className="card overflow-x-auto" role="region" aria-label="Work orders" tabIndex={0}>
        <table className="w-full min-w-[760px] text-left text-sm">
          <thead className="border-b border-paper-line bg-paper-sunk/60 text-xs uppercase tracking-wide text-ink-muted">
            {table.getHeaderGroups().map((g) => (
              <tr key={g.id}>
                {g.headers.map((h) => (canAssign || h.column.id !== "select" ? <th key={h.id} className="px-3 py-2 font-semibold">{h.isPlaceholder ? null : <table.FlexRender header={h} />}</th> : null))}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="border-b border-paper-line last:border-0">
                {row.getAllCells().map((cell) => (canAssign || cell.column.id !== "select" ? <td key={cell.id} className="px-3 py-2 align-top"><table.FlexRender cell={cell} /></td> : null))}
              </tr>
            ))}
            {result.data && result.data.items.length === 0 ? (
              <tr><td colSpan={8} className="px-3 py-6 text-center text-ink-muted">No work orders match these filters.</td></tr>
            ) : null}
          </tbody>
        </table>
      </div>
      <div className="flex items-center justify-between gap-2 text-sm">
        <span className="text-ink-muted" role="status">
          {result.isFetching ? "Loading…" : total ? <>Showing <span className="num">{offset + 1}–{Math.min(offset + PAGE, total)}</span> of <span className="num">{total}</span></> : null}
        </span>
        <div className="flex gap-2">
          <Button disabled={offset === 0} onClick={() => { setOffset(Math.max(0, offset - PAGE)); setRowSelection({}); }}>Previous</Button>
          <Button disabled={offset + PAGE >= total} onClick={() => { setOffset(offset + PAGE); setRowSelection({}); }}>Next</Button>
        </div>
      </div>
    </div>
  );
}
