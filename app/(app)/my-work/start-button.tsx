"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { apiFetch, ApiError } from "@/components/maintenance/api-client";

/** One tap: the order moves to in progress (and to me, if nobody had it), then the close screen. */
export function StartButton({ id, version, label }: { id: number; version: number; label: string }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  async function start() {
    setBusy(true);
    setError(null);
    try {
      await apiFetch(`/api/v1/work-orders/${id}`, { method: "PATCH", json: { version, state: "in_progress" } });
      router.push(`/work-orders/${id}/close`);
    } catch (e) {
      setError(e instanceof ApiError ? e.message : "Could not reach the server; check the connection and try again.");
      setBusy(false);
      if (e instanceof ApiError && e.code === "conflict") router.refresh();
    }
  }
  return (
    <>
      <Button variant="primary" className="min-h-12 w-full text-base" onClick={start} disabled={busy} aria-label={label}>
        {busy ? "Starting…" : "Start"}
      </Button>
      {error ? <p role="alert" className="mt-2 text-sm text-health-act">{error}</p> : null}
    </>
  );
}
