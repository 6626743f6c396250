"use client";
import { useState } from "react";
import { ActionForm } from "@/components/ui/action-form";
import { Button } from "@/components/ui/button";
import { SelectField, TextField } from "@/components/ui/field";
import { icalText, ruleForWeekdays } from "@/lib/mail/schedule";
import { updateMailTimeZoneAction, updateSubscriptionAction } from "./actions";

const DAYS = [
  ["MO", "Mon"], ["TU", "Tue"], ["WE", "Wed"], ["TH", "Thu"], ["FR", "Fri"], ["SA", "Sat"], ["SU", "Sun"],
] as const;

export type SubscriptionView = {
  kind: string;
  label: string;
  about: string;
  scheduled: boolean;
  enabled: boolean;
  weekdays: string[];
  sendAt: string;
  next: string[];
};

export function SubscriptionForm({ userId, timeZone, sub }: { userId: string; timeZone: string; sub: SubscriptionView }) {
  const [days, setDays] = useState<string[]>(sub.weekdays);
  const [time, setTime] = useState(sub.sendAt);
  const rule = days.length ? ruleForWeekdays(days) : null;
  const id = (s: string) => `${sub.kind}-${s}`;
  return (
    <ActionForm action={updateSubscriptionAction} className="card grid gap-4 p-5">
      {({ fields, pending }) => (
        <>
          <input type="hidden" name="userId" value={userId} />
          <input type="hidden" name="kind" value={sub.kind} />
          <label className="flex min-h-11 cursor-pointer items-start gap-3">
            <input type="checkbox" name="enabled" defaultChecked={sub.enabled} className="mt-1 size-5 accent-[var(--color-ember,#c2410c)]" />
            <span>
              <span className="block font-semibold">{sub.label}</span>
              <span className="block text-sm text-ink-muted">{sub.about}</span>
            </span>
          </label>
          {sub.scheduled ? (
            <div className="grid gap-3 sm:grid-cols-[1fr_9rem] sm:items-end">
              <fieldset>
                <legend className="mb-1 text-sm font-medium text-ink-soft">On</legend>
                <div className="flex flex-wrap gap-2">
                  {DAYS.map(([code, short]) => (
                    <label key={code} className="inline-flex min-h-11 min-w-14 cursor-pointer items-center justify-center gap-1 rounded-lg border border-paper-line bg-paper-raised px-2 text-sm has-[:checked]:border-ember has-[:checked]:bg-ember-soft">
                      <input
                        type="checkbox"
                        name={`day_${code}`}
                        checked={days.includes(code)}
                        onChange={(e) => setDays((d) => (e.target.checked ? [...d, code] : d.filter((x) => x !== code)))}
                        className="sr-only"
                      />
                      {short}
                    </label>
                  ))}
                </div>
                {fields?.weekdays ? <p className="mt-1 text-sm text-health-act" role="alert">Weekdays: {fields.weekdays}</p> : null}
              </fieldset>
              <TextField label="At" id={id("sendAt")} name="sendAt" type="time" value={time} onChange={(e) => setTime(e.target.value)} error={fields?.sendAt} />
              <div className="sm:col-span-2 text-xs text-ink-muted">
                <p>
                  On your clock ({timeZone}). {sub.next.length ? `Next: ${sub.next.join(" · ")}` : null}
                </p>
                {rule && time ? <pre className="mt-1 overflow-x-auto rounded bg-paper-sunk p-2 font-mono" aria-label="The recurrence rule this makes">{icalText(rule, time, timeZone)}</pre> : null}
              </div>
            </div>
          ) : null}
          <div>
            <Button type="submit" variant="primary" disabled={pending}>
              Save
            </Button>
          </div>
        </>
      )}
    </ActionForm>
  );
}

export function TimeZoneForm({ userId, timeZone, zones }: { userId: string; timeZone: string; zones: string[] }) {
  return (
    <ActionForm action={updateMailTimeZoneAction} className="card grid gap-3 p-5 sm:grid-cols-[1fr_auto] sm:items-end">
      {({ fields, pending }) => (
        <>
          <input type="hidden" name="userId" value={userId} />
          <SelectField label="Time zone for scheduled e-mails" name="timeZone" defaultValue={timeZone} error={fields?.timeZone}>
            {zones.map((z) => (
              <option key={z} value={z}>
                {z}
              </option>
            ))}
          </SelectField>
          <Button type="submit" disabled={pending}>
            Save time zone
          </Button>
        </>
      )}
    </ActionForm>
  );
}
