"use client";
import { ActionForm } from "@/components/ui/action-form";
import { Button } from "@/components/ui/button";
import { SelectField, TextField } from "@/components/ui/field";
import { METRIC_INFO, TRACKED_METRICS } from "@/lib/tracked-metrics";
import type { DriftParams } from "@/lib/drift/drift-types";
import { setBaselineByDatesAction, setDriftSettingsAction } from "./actions";

// Engineers' controls: the detectors' settings for this oven, and a baseline picked by dates.
export function DriftControls({ ovenId, params }: { ovenId: number; params: DriftParams }) {
  return (
    <details className="card p-4">
      <summary className="cursor-pointer font-semibold">Drift settings and baseline</summary>
      <div className="mt-3 grid gap-6 lg:grid-cols-2">
        <ActionForm action={setDriftSettingsAction} className="grid grid-cols-2 gap-3">
          {({ fields, pending }) => (
            <>
              <input type="hidden" name="ovenId" value={ovenId} />
              <TextField label="EWMA λ" name="lambda" id="drift-lambda" inputMode="decimal" defaultValue={params.lambda} error={fields?.lambda} />
              <TextField label="EWMA limit width L (σ)" name="L" id="drift-L" inputMode="decimal" defaultValue={params.L} error={fields?.L} />
              <TextField label="CUSUM k (σ)" name="cusumK" id="drift-k" inputMode="decimal" defaultValue={params.cusumK} error={fields?.cusumK} />
              <TextField label="CUSUM h (σ)" name="cusumH" id="drift-h" inputMode="decimal" defaultValue={params.cusumH} error={fields?.cusumH} />
              <div className="col-span-2">
                <Button type="submit" disabled={pending}>
                  Save settings
                </Button>
              </div>
            </>
          )}
        </ActionForm>
        <ActionForm action={setBaselineByDatesAction} className="grid grid-cols-2 gap-3">
          {({ fields, pending }) => (
            <>
              <input type="hidden" name="ovenId" value={ovenId} />
              <div className="col-span-2">
                <SelectField label="Metric" name="metric" id="baseline-metric" error={fields?.metric}>
                  {TRACKED_METRICS.map((m) => (
                    <option key={m} value={m}>
                      {METRIC_INFO[m].label}
                    </option>
                  ))}
                </SelectField>
              </div>
              <TextField label="Baseline from" name="from" id="baseline-from" type="date" error={fields?.from} />
              <TextField label="Baseline to" name="to" id="baseline-to" type="date" error={fields?.to} />
              <div className="col-span-2">
                <Button type="submit" disabled={pending}>
                  Use these runs as the baseline
                </Button>
              </div>
            </>
          )}
        </ActionForm>
      </div>
    </details>
  );
}
