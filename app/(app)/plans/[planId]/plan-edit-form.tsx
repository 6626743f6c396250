"use client";
import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import { apiFetch, ApiError } from "@/components/maintenance/api-client";
import { describeRrule } from "@/lib/maintenance/rrule-builder";
import { nextOccurrences } from "@/lib/maintenance/recurrence";

type Plan = { id: number; version: number; title: string; estimatedMinutes: number | null; active: boolean; rrule: string | null; dtstart: string | null };
const control = "block w-full min-h-11 rounded-lg border border-paper-line bg-paper-raised px-3 py-2 text-base";

export function PlanEditForm({ plan, timeZone }: { plan: Plan; timeZone: string }) {
  const router = useRouter();
  const [title, setTitle] = useState(plan.title);
  const [minutes, setMinutes] = useState(plan.estimatedMinutes?.toString() ?? "");
  const [active, setActive] = useState(plan.active);
  const [rrule, setRrule] = useState(plan.rrule ?? "");
  const [dtstart, setDtstart] = useState(plan.dtstart ?? "");
  const [message, setMessage] = useState<{ ok: boolean; text: string; conflict?: boolean } | null>(null);
  const preview = useMemo(() => {
    if (!plan.rrule) return null;
    try {
      const next = nextOccurrences({ rrule, dtstartLocal: dtstart, timeZone, after: new Date() }, 5);
      return { text: describeRrule(rrule, { timeZone }), next };
    } catch (e) {
      return { error: (e as Error).message };
    }
  }, [plan.rrule, rrule, dtstart, timeZone]);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setMessage(null);
    try {
      await apiFetch(`/api/v1/plans/${plan.id}`, {
        method: "PATCH",
        json: {
          version: plan.version, title, active, estimatedMinutes: minutes ? Number(minutes) : null,
          ...(plan.rrule ? { rrule: rrule.replace(/^RRULE:/i, ""), dtstart } : {}),
        },
      });
      setMessage({ ok: true, text: "Saved." });
      router.refresh();
    } catch (err) {
      setMessage({ ok: false, text: err instanceof ApiError ? err.message : "Could not reach the server.", conflict: err instanceof ApiError && err.code === "conflict" });
    }
  }
  return (
    <form onSubmit={submit} className="space-y-3" noValidate>
      <label className="block text-sm font-medium text-ink-soft">Title<input className={control} value={title} onChange={(e) => setTitle(e.target.value)} /></label>
      <label className="block max-w-xs text-sm font-medium text-ink-soft">Estimated minutes<input inputMode="numeric" className={`${control} num`} value={minutes} onChange={(e) => setMinutes(e.target.value.replace(/\D/g, ""))} /></label>
      {plan.rrule ? (
        <div className="grid gap-3 sm:grid-cols-2">
          <label className="block text-sm font-medium text-ink-soft">RRULE<input className={`${control} font-mono text-sm`} value={rrule} onChange={(e) => setRrule(e.target.value)} /></label>
          <label className="block text-sm font-medium text-ink-soft">Start (site time)<input type="datetime-local" className={control} value={dtstart} onChange={(e) => setDtstart(e.target.value)} /></label>
        </div>
      ) : null}
      {preview ? (
        <div className="rounded-lg bg-paper-sunk p-3 text-sm" aria-live="polite">
          {"error" in preview ? <p className="text-health-act">{preview.error}</p> : (
            <>
              <p className="font-medium">{preview.text}</p>
              <ol className="num mt-1 list-decimal pl-5">{preview.next.map((d) => <li key={d.toISOString()}>{new Intl.DateTimeFormat("en-GB", { timeZone, dateStyle: "medium", timeStyle: "short" }).format(d)}</li>)}</ol>
            </>
          )}
        </div>
      ) : null}
      <label className="flex min-h-11 items-center gap-2 text-sm"><input type="checkbox" className="h-5 w-5" checked={active} onChange={(e) => setActive(e.target.checked)} /> Active (unticked: no new orders are generated)</label>
      {message ? (
        <p role={message.ok ? "status" : "alert"} className={`text-sm ${message.ok ? "text-health-steady" : "text-health-act"}`}>
          {message.text} {message.conflict ? <button type="button" className="underline" onClick={() => router.refresh()}>Reload</button> : null}
        </p>
      ) : null}
      <Button type="submit" variant="primary">Save changes</Button>
    </form>
  );
}
