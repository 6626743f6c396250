"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { apiFetch, ApiError } from "./api-client";

/** Unplanned work on an oven: a fault, or a breakdown that stopped production. */
export function RaiseOrderForm({ ovenId }: { ovenId: number }) {
  const router = useRouter();
  const [title, setTitle] = useState("");
  const [breakdown, setBreakdown] = useState(false);
  const [notes, setNotes] = useState("");
  const [error, setError] = useState<string | null>(null);
  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setError(null);
    try {
      const created = await apiFetch<{ id: number }>("/api/v1/work-orders", {
        method: "POST",
        json: { ovenId, title, kind: "corrective", breakdown, priority: breakdown ? "urgent" : "normal", notes: notes || undefined },
      });
      router.push(`/work-orders/${created.id}`);
    } catch (err) {
      setError(err instanceof ApiError ? err.message : "Could not reach the server.");
    }
  }
  return (
    <form onSubmit={submit} className="space-y-2" aria-label="Report a problem">
      <label htmlFor="raise-title" className="block text-sm font-medium text-ink-soft">What is wrong?</label>
      <input id="raise-title" value={title} onChange={(e) => setTitle(e.target.value)} className="block min-h-11 w-full rounded-lg border border-paper-line bg-paper-raised px-3 text-base" placeholder="e.g. Conveyor stalls at zone 5" />
      <label htmlFor="raise-notes" className="block text-sm font-medium text-ink-soft">Details (optional)</label>
      <textarea id="raise-notes" value={notes} onChange={(e) => setNotes(e.target.value)} className="block min-h-16 w-full rounded-lg border border-paper-line bg-paper-raised px-3 py-2 text-base" />
      <label className="flex min-h-11 items-center gap-2 text-sm"><input type="checkbox" className="h-5 w-5" checked={breakdown} onChange={(e) => setBreakdown(e.target.checked)} /> The oven has stopped production (breakdown; downtime counts from now)</label>
      {error ? <p role="alert" className="text-sm text-health-act">{error}</p> : null}
      <Button type="submit" variant="primary" disabled={!title.trim()}>Raise a corrective order</Button>
    </form>
  );
}
