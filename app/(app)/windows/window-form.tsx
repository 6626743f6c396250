"use client";
import { useState } from "react";
import { ActionForm } from "@/components/ui/action-form";
import { Button } from "@/components/ui/button";
import { SelectField, TextAreaField, TextField } from "@/components/ui/field";
import type { ActionResult } from "@/lib/action";
import { WINDOW_PRESETS, type ProcessWindow } from "@/lib/thermal/windows";

type Action = (prev: ActionResult<unknown> | null, form: FormData) => Promise<ActionResult<unknown>>;

const GROUPS: { title: string; fields: [keyof ProcessWindow, string, string][] }[] = [
  { title: "Peak and liquidus", fields: [["liquidus", "Liquidus", "°C"], ["peakMin", "Peak, lowest", "°C"], ["peakMax", "Peak, highest", "°C"], ["deltaTMax", "ΔT at peak, most", "°C"], ["criticalSpreadMax", "Critical spread, most (optional)", "°C"]] },
  { title: "Time above liquidus and soak", fields: [["talMin", "TAL, shortest", "s"], ["talMax", "TAL, longest", "s"], ["soakStart", "Soak from", "°C"], ["soakEnd", "Soak to", "°C"], ["soakMin", "Soak, shortest", "s"], ["soakMax", "Soak, longest", "s"]] },
  { title: "Rates and timing", fields: [["rampUpMax", "Ramp-up, most", "°C/s"], ["rampDownMax", "Ramp-down, most", "°C/s"], ["rampWindow", "Ramp window", "s"], ["heatUpFrom", "Heat-up from", "°C"], ["heatUpTo", "Heat-up to", "°C"], ["timeToPeakMax", "25 °C → peak, most", "s"]] },
];

export function WindowForm({ action, initial, windowId, readOnly }: { action: Action; initial?: { name: string; presetId: string | null; values: ProcessWindow; notes: string | null }; windowId?: number; readOnly?: boolean }) {
  const [presetId, setPresetId] = useState(initial?.presetId ?? WINDOW_PRESETS[0].id);
  const preset = WINDOW_PRESETS.find((p) => p.id === presetId);
  const asText = (w: ProcessWindow) => Object.fromEntries(GROUPS.flatMap((g) => g.fields).map(([k]) => [k, w[k] === undefined ? "" : String(w[k])]));
  // Controlled fields: a form action resets uncontrolled ones, and a rejected form must keep what was typed.
  const [vals, setVals] = useState<Record<string, string>>(() => asText(initial?.values ?? preset!.window));
  const [name, setName] = useState(initial?.name ?? "");
  const [notes, setNotes] = useState(initial?.notes ?? "");
  const choosePreset = (id: string) => {
    setPresetId(id);
    const p = WINDOW_PRESETS.find((x) => x.id === id);
    if (p) setVals(asText(p.window));
  };
  return (
    <ActionForm action={action} className="space-y-5">
      {({ fields, pending }) => (
        <fieldset disabled={readOnly} className="space-y-5">
          {windowId ? <input type="hidden" name="windowId" value={windowId} /> : null}
          <div className="grid gap-3 sm:grid-cols-2">
            <TextField label="Name" name="name" value={name} onChange={(e) => setName(e.target.value)} error={fields?.name} required />
            {windowId ? (
              <input type="hidden" name="presetId" value={presetId} />
            ) : (
              <SelectField label="Start from preset" name="presetId" value={presetId} onChange={(e) => choosePreset(e.target.value)}>
                {WINDOW_PRESETS.map((p) => <option key={p.id} value={p.id}>{p.name}</option>)}
              </SelectField>
            )}
          </div>
          {preset && !windowId ? <p className="text-xs text-ink-muted">{preset.source} {preset.note}</p> : null}
          <div className="grid gap-4 lg:grid-cols-3">
            {GROUPS.map((g) => (
              <fieldset key={g.title} className="space-y-2 rounded-lg border border-paper-line p-3">
                <legend className="px-1 text-sm font-semibold">{g.title}</legend>
                {g.fields.map(([key, label, unit]) => (
                  <TextField key={key} label={`${label} (${unit})`} name={key} inputMode="decimal" value={vals[key] ?? ""} onChange={(e) => setVals((v) => ({ ...v, [key]: e.target.value }))} error={fields?.[key] ?? fields?.[`values.${key}`]} />
                ))}
              </fieldset>
            ))}
          </div>
          <TextAreaField label="Notes" name="notes" value={notes} onChange={(e) => setNotes(e.target.value)} error={fields?.notes} />
          {!readOnly ? <Button type="submit" variant="primary" disabled={pending}>{windowId ? "Save as a new version" : "Create window"}</Button> : null}
        </fieldset>
      )}
    </ActionForm>
  );
}
