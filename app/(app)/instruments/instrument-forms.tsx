"use client";
import { ActionForm } from "@/components/ui/action-form";
import { Button } from "@/components/ui/button";
import { SelectField, TextAreaField, TextField } from "@/components/ui/field";
import { THERMOCOUPLE_TYPES, TOLERANCE_CLASSES, TOLERANCE_CLASS_LABELS } from "@/lib/validation/instruments";
import { createCalibrationAction, createInstrumentAction } from "./actions";

export function NewInstrumentForm() {
  return (
    <ActionForm action={createInstrumentAction} className="grid gap-3 sm:grid-cols-2">
      {({ fields, pending }) => (
        <>
          <SelectField label="Kind" name="kind" defaultValue="logger" error={fields?.kind}>
            <option value="logger">Data logger</option>
            <option value="probe_set">Probe set</option>
          </SelectField>
          <TextField label="Name" name="name" error={fields?.name} />
          <TextField label="Serial number" name="serial" error={fields?.serial} />
          <TextField label="Channels" name="channelCount" inputMode="numeric" defaultValue="8" error={fields?.channelCount} />
          <TextField label="Scan skew between channels (s)" name="scanSkewSeconds" inputMode="decimal" defaultValue="0" error={fields?.scanSkewSeconds} hint="Loggers that scan channels in turn: the time from one channel to the next." />
          <TextField label="Resolution (°C)" name="resolution" inputMode="decimal" error={fields?.resolution} />
          <TextField label="Accuracy (± °C)" name="accuracy" inputMode="decimal" error={fields?.accuracy} />
          <SelectField label="Thermocouple type (probe sets)" name="thermocoupleType" defaultValue="" error={fields?.thermocoupleType}>
            <option value="">—</option>
            {THERMOCOUPLE_TYPES.map((t) => <option key={t} value={t}>Type {t}</option>)}
          </SelectField>
          <SelectField label="Tolerance class (probe sets)" name="toleranceClass" defaultValue="" error={fields?.toleranceClass}>
            <option value="">—</option>
            {TOLERANCE_CLASSES.map((t) => <option key={t} value={t}>{TOLERANCE_CLASS_LABELS[t]}</option>)}
          </SelectField>
          <div className="sm:col-span-2"><TextAreaField label="Notes" name="notes" error={fields?.notes} /></div>
          <div><Button type="submit" variant="primary" disabled={pending}>Add instrument</Button></div>
        </>
      )}
    </ActionForm>
  );
}

export function CalibrationForm({ instrumentId, channels }: { instrumentId: number; channels: number }) {
  return (
    <ActionForm action={createCalibrationAction} className="space-y-3">
      {({ fields, pending }) => (
        <>
          <input type="hidden" name="instrumentId" value={instrumentId} />
          <div className="grid gap-3 sm:grid-cols-2">
            <TextField label="Calibrated on" name="performedAt" type="date" error={fields?.performedAt} />
            <TextField label="Due on (default: one year later)" name="dueAt" type="date" error={fields?.dueAt} />
            <TextField label="Performed by" name="performedBy" error={fields?.performedBy} />
            <TextField label="Reference used" name="reference" error={fields?.reference} />
            <TextField label="Expanded uncertainty (± °C, k = 2)" name="expandedUncertainty" inputMode="decimal" error={fields?.expandedUncertainty} />
            <TextField label="Certificate (PDF, PNG or JPEG, ≤ 10 MB)" name="certificate" type="file" accept="application/pdf,image/png,image/jpeg" error={fields?.certificate} />
          </div>
          <TextAreaField
            label="Offsets per channel (°C, JSON)"
            name="offsets"
            placeholder={`{"1": 0.2, "2": -0.1${channels > 2 ? ', "3": 0.15' : ""}}`}
            hint="Added to each channel's readings. Channel numbers are the logger's scan order (1 = first probe column)."
            error={fields?.offsets}
          />
          <Button type="submit" variant="primary" disabled={pending}>Record calibration</Button>
        </>
      )}
    </ActionForm>
  );
}
