"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { apiFetch, ApiError } from "@/components/maintenance/api-client";
import type { ChecklistItem, ChecklistResult, WorkOrderKind, WorkOrderState } from "@/lib/maintenance/work-order-state";

type Order = {
  id: number;
  number: string;
  version: number;
  state: WorkOrderState;
  kind: WorkOrderKind;
  checklist: ChecklistItem[];
  checklistResults: Record<string, ChecklistResult>;
  notes: string;
  labourMinutes: number | null;
  downtimeMinutes: number | null;
  breakdown: boolean;
  parts: { description: string; quantity: number }[];
};

const input = "block w-full min-h-12 rounded-lg border border-paper-line bg-paper-raised px-3 py-2 text-base";

function Toggle({ item, value, onChange }: { item: ChecklistItem; value: boolean | null; onChange: (v: boolean) => void }) {
  const btn = (on: boolean, label: string, tone: string) => (
    <button
      type="button"
      aria-pressed={value === on}
      onClick={() => onChange(on)}
      className={`min-h-12 flex-1 rounded-lg border px-3 text-base font-semibold ${value === on ? tone : "border-paper-line bg-paper-raised text-ink-soft"}`}
    >
      {label}
    </button>
  );
  return (
    <fieldset className="card p-3" role="group" aria-label={item.label}>
      <legend className="sr-only">{item.label}</legend>
      <p className="text-base leading-snug text-ink">
        {item.label}
        {item.mandatory ? <span className="text-health-act"> *</span> : <span className="text-sm text-ink-muted"> (optional)</span>}
      </p>
      <div className="mt-2 flex gap-2">
        {btn(true, "OK", "border-health-steady bg-teal-50 text-health-steady")}
        {btn(false, "Not OK", "border-health-act bg-red-50 text-health-act")}
      </div>
    </fieldset>
  );
}

export function CloseForm({ order }: { order: Order }) {
  const router = useRouter();
  const [results, setResults] = useState<Record<string, boolean | null>>(
    Object.fromEntries(order.checklist.map((c) => [c.id, order.checklistResults[c.id]?.ok ?? null])),
  );
  const [notes, setNotes] = useState(order.notes);
  const [labour, setLabour] = useState(order.labourMinutes?.toString() ?? "");
  const [downtime, setDowntime] = useState(order.downtimeMinutes?.toString() ?? "");
  const [parts, setParts] = useState(order.parts.length ? order.parts : []);
  const [photos, setPhotos] = useState<File[]>([]);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<{ message: string; conflict: boolean } | null>(null);
  const showDowntime = order.kind === "corrective" || order.breakdown;

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    setError(null);
    try {
      let version = order.version;
      if (order.state === "on_hold") {
        version = (await apiFetch<{ version: number }>(`/api/v1/work-orders/${order.id}`, { method: "PATCH", json: { version, state: "in_progress" } })).version;
      }
      for (const photo of photos) {
        const form = new FormData();
        form.append("file", photo);
        await apiFetch(`/api/v1/work-orders/${order.id}/attachments`, { method: "POST", body: form });
      }
      const checklistResults = Object.fromEntries(Object.entries(results).filter(([, v]) => v !== null).map(([k, v]) => [k, { ok: v }]));
      await apiFetch(`/api/v1/work-orders/${order.id}`, {
        method: "PATCH",
        json: {
          version,
          state: "done",
          checklistResults,
          notes: notes.trim() || null,
          labourMinutes: labour ? Number(labour) : null,
          ...(showDowntime ? { downtimeMinutes: downtime ? Number(downtime) : null } : {}),
          parts: parts.filter((p) => p.description.trim()),
        },
      });
      router.push(`/work-orders/${order.id}?closed=1`);
      router.refresh();
    } catch (err) {
      const conflict = err instanceof ApiError && err.code === "conflict";
      setError({ message: err instanceof ApiError ? err.message : "Could not reach the server; nothing was saved. Try again.", conflict });
      setBusy(false);
    }
  }

  return (
    <form onSubmit={submit} className="space-y-4" noValidate>
      {order.checklist.length ? (
        <section aria-label="Checklist" className="space-y-2">
          <h2 className="text-base font-semibold">Checklist</h2>
          {order.checklist.map((item) => (
            <Toggle key={item.id} item={item} value={results[item.id]} onChange={(v) => setResults((r) => ({ ...r, [item.id]: v }))} />
          ))}
        </section>
      ) : null}
      <div className="space-y-1">
        <label htmlFor="notes" className="block text-sm font-medium text-ink-soft">Notes</label>
        <textarea id="notes" className={`${input} min-h-24`} value={notes} onChange={(e) => setNotes(e.target.value)} placeholder="What you found and did" />
      </div>
      <div className="grid grid-cols-2 gap-3">
        <div className="space-y-1">
          <label htmlFor="labour" className="block text-sm font-medium text-ink-soft">Labour (minutes)</label>
          <input id="labour" inputMode="numeric" className={`${input} num`} value={labour} onChange={(e) => setLabour(e.target.value.replace(/\D/g, ""))} />
        </div>
        {showDowntime ? (
          <div className="space-y-1">
            <label htmlFor="downtime" className="block text-sm font-medium text-ink-soft">Downtime (minutes)</label>
            <input id="downtime" inputMode="numeric" className={`${input} num`} value={downtime} onChange={(e) => setDowntime(e.target.value.replace(/\D/g, ""))} />
          </div>
        ) : null}
      </div>
      <section aria-label="Parts used" className="space-y-2">
        <h2 className="text-base font-semibold">Parts used</h2>
        {parts.map((p, i) => (
          <div key={i} className="flex gap-2">
            <input aria-label={`Part ${i + 1}`} className={`${input} flex-1`} value={p.description} onChange={(e) => setParts((ps) => ps.map((x, j) => (j === i ? { ...x, description: e.target.value } : x)))} />
            <input aria-label={`Quantity of part ${i + 1}`} inputMode="decimal" className={`${input} num w-20`} value={p.quantity} onChange={(e) => setParts((ps) => ps.map((x, j) => (j === i ? { ...x, quantity: Number(e.target.value) || 0 } : x)))} />
          </div>
        ))}
        <Button type="button" onClick={() => setParts((ps) => [...ps, { description: "", quantity: 1 }])}>Add a part</Button>
      </section>
      <div className="space-y-1">
        <label htmlFor="photo" className="block text-sm font-medium text-ink-soft">Photo or document</label>
        <input id="photo" type="file" accept="image/jpeg,image/png,image/webp,application/pdf" capture="environment" multiple className="block w-full min-h-12 text-base" onChange={(e) => setPhotos([...(e.target.files ?? [])])} />
        <p className="text-xs text-ink-muted">JPEG, PNG, WebP or PDF, up to 10 MB each.{photos.length ? ` ${photos.length} selected.` : ""}</p>
      </div>
      {error ? (
        <div role="alert" className="card border-health-act/40 bg-red-50 p-3 text-sm text-health-act">
          <p>{error.message}</p>
          {error.conflict ? (
            <Button type="button" className="mt-2" onClick={() => { setError(null); router.refresh(); }}>
              Reload the order (your answers stay here)
            </Button>
          ) : null}
        </div>
      ) : null}
      <Button type="submit" variant="primary" className="min-h-12 w-full text-base" disabled={busy}>
        {busy ? "Closing…" : `Close ${order.number}`}
      </Button>
    </form>
  );
}
