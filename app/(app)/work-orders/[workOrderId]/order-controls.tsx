"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { apiFetch, ApiError } from "@/components/maintenance/api-client";
import type { WorkOrderState } from "@/lib/maintenance/work-order-state";

const LABELS: Partial<Record<WorkOrderState, string>> = { in_progress: "Start / resume", on_hold: "Put on hold", open: "Hand back to the queue", cancelled: "Cancel order" };

export function StateButtons({ id, version, targets }: { id: number; version: number; targets: readonly WorkOrderState[] }) {
  const router = useRouter();
  const [error, setError] = useState<{ message: string; conflict: boolean } | null>(null);
  async function move(state: WorkOrderState) {
    setError(null);
    try {
      await apiFetch(`/api/v1/work-orders/${id}`, { method: "PATCH", json: { version, state } });
      router.refresh();
    } catch (e) {
      setError({ message: e instanceof ApiError ? e.message : "Could not reach the server.", conflict: e instanceof ApiError && e.code === "conflict" });
    }
  }
  return (
    <>
      {targets.map((s) => (
        <Button key={s} variant={s === "cancelled" ? "danger" : "secondary"} onClick={() => move(s)}>{LABELS[s] ?? s}</Button>
      ))}
      {error ? (
        <p role="alert" className="w-full text-sm text-health-act">
          {error.message} {error.conflict ? <button className="underline" onClick={() => { setError(null); router.refresh(); }}>Reload</button> : null}
        </p>
      ) : null}
    </>
  );
}

export function CommentForm({ id }: { id: number }) {
  const router = useRouter();
  const [body, setBody] = useState("");
  const [error, setError] = useState<string | null>(null);
  async function send(e: React.FormEvent) {
    e.preventDefault();
    try {
      await apiFetch(`/api/v1/work-orders/${id}/comments`, { method: "POST", json: { body } });
      setBody("");
      router.refresh();
    } catch (err) {
      setError(err instanceof ApiError ? err.message : "Could not reach the server.");
    }
  }
  return (
    <form onSubmit={send} className="space-y-2">
      <label htmlFor="comment" className="block text-sm font-medium text-ink-soft">Add a comment (mention someone with @name)</label>
      <textarea id="comment" value={body} onChange={(e) => setBody(e.target.value)} className="block min-h-20 w-full rounded-lg border border-paper-line bg-paper-raised px-3 py-2 text-base" />
      {error ? <p role="alert" className="text-sm text-health-act">{error}</p> : null}
      <Button type="submit" disabled={!body.trim()}>Post comment</Button>
    </form>
  );
}
