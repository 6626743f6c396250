"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { apiFetch, ApiError } from "@/components/maintenance/api-client";

export function MeterForm({ ovenId }: { ovenId: number }) {
  const router = useRouter();
  const [kind, setKind] = useState("heater_hours");
  const [value, setValue] = useState("");
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  async function submit(e: React.FormEvent) {
    e.preventDefault();
    try {
      await apiFetch(`/api/v1/ovens/${ovenId}/meters`, { method: "POST", json: { kind, value: Number(value) } });
      setValue("");
      setMessage({ ok: true, text: "Reading saved." });
      router.refresh();
    } catch (err) {
      setMessage({ ok: false, text: err instanceof ApiError ? err.message : "Could not reach the server." });
    }
  }
  return (
    <form onSubmit={submit} className="flex flex-wrap items-end gap-2" aria-label="Record a meter reading">
      <label className="text-sm">Meter<br />
        <select className="min-h-11 rounded-lg border border-paper-line bg-paper-raised px-2" value={kind} onChange={(e) => setKind(e.target.value)}>
          <option value="heater_hours">Heater hours</option><option value="conveyor_hours">Conveyor hours</option><option value="cycles">Cycles</option>
        </select>
      </label>
      <label className="text-sm">Reading now<br /><input inputMode="decimal" className="num min-h-11 w-36 rounded-lg border border-paper-line bg-paper-raised px-2" value={value} onChange={(e) => setValue(e.target.value)} /></label>
      <Button type="submit" disabled={!value}>Record</Button>
      {message ? <p role={message.ok ? "status" : "alert"} className={`w-full text-sm ${message.ok ? "text-health-steady" : "text-health-act"}`}>{message.text}</p> : null}
    </form>
  );
}
