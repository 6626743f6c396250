"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { apiFetch, ApiError } from "./api-client";

/** Runs generation now (it is idempotent, so pressing twice is harmless). */
export function GenerateButton() {
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function run() {
    setBusy(true);
    try {
      const r = await apiFetch<{ created: number }>("/api/v1/maintenance/generate", { method: "POST", json: {} });
      setMessage(r.created ? `${r.created} new work order${r.created === 1 ? "" : "s"}.` : "Everything due in the look-ahead window already has its work order.");
      router.refresh();
    } catch (e) {
      setMessage(e instanceof ApiError ? e.message : "Could not reach the server.");
    } finally {
      setBusy(false);
    }
  }
  return (
    <span className="flex flex-wrap items-center gap-2">
      <Button onClick={run} disabled={busy}>{busy ? "Generating…" : "Generate work orders now"}</Button>
      {message ? <span role="status" className="text-sm text-ink-soft">{message}</span> : null}
    </span>
  );
}
