"use client";
import { useState } from "react";
import { ActionForm } from "@/components/ui/action-form";
import { Button } from "@/components/ui/button";
import { SelectField, TextAreaField, TextField } from "@/components/ui/field";
import { SafetyNote } from "@/components/oven/safety-note";
import { CHANGE_AREA_LABELS, CHANGE_AREA_VALUES, SAFETY_CRITICAL_AREAS } from "@/lib/validation/change";
import { createChangeAction } from "./actions";

const localNow = () => {
  const d = new Date();
  d.setSeconds(0, 0);
  return new Date(d.getTime() - d.getTimezoneOffset() * 60_000).toISOString().slice(0, 16);
};

export function ChangeForm({ ovenId }: { ovenId: number }) {
  const [when, setWhen] = useState(localNow);
  const [area, setArea] = useState("fan");
  // The picker gives the wall time of this device; the server stores the instant.
  const iso = when ? new Date(when).toISOString() : "";
  return (
    <ActionForm action={createChangeAction} className="card grid gap-4 p-5 sm:grid-cols-2">
      {({ fields, pending }) => (
        <>
          <input type="hidden" name="ovenId" value={ovenId} />
          <input type="hidden" name="at" value={iso} />
          <div className="sm:col-span-2">
            <SafetyNote kind="modification" />
          </div>
          <TextField label="When" name="when" id="change-when" type="datetime-local" value={when} onChange={(e) => setWhen(e.target.value)} error={fields?.at} />
          <SelectField label="Area" name="area" value={area} onChange={(e) => setArea(e.target.value)} error={fields?.area}>
            {CHANGE_AREA_VALUES.map((a) => (
              <option key={a} value={a}>
                {CHANGE_AREA_LABELS[a]}
              </option>
            ))}
          </SelectField>
          <div className="sm:col-span-2">
            <TextField label="What changed" name="summary" placeholder="e.g. Circulation fan re-shaped" error={fields?.summary} />
          </div>
          <TextField label="Before" name="before" placeholder="e.g. blade 40 mm, speed 60 %" error={fields?.before} />
          <TextField label="After" name="after" placeholder="e.g. blade 55 mm, speed 75 %" error={fields?.after} />
          <div className="sm:col-span-2">
            <TextAreaField label="Why" name="reason" error={fields?.reason} />
          </div>
          <TextField label="Work order number (optional)" name="workOrderId" inputMode="numeric" error={fields?.workOrderId} />
          <TextField label="Photo or document (optional)" name="attachment" id="change-attachment" type="file" accept="image/jpeg,image/png,image/webp,application/pdf" hint="JPEG, PNG, WebP or PDF, up to 10 MB." error={fields?.attachment ?? fields?.file} />
          <div className="flex items-end">
            <Button variant="primary" type="submit" disabled={pending}>
              {pending ? "Logging…" : "Log the change"}
            </Button>
          </div>
          {SAFETY_CRITICAL_AREAS.has(area) ? (
            <p className="text-sm text-ink-muted sm:col-span-2">This area touches heating or airflow: plan verification runs before and after it so its effect can be proved.</p>
          ) : null}
        </>
      )}
    </ActionForm>
  );
}
