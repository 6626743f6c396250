"use client";
import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import { apiFetch, ApiError } from "@/components/maintenance/api-client";
import { buildRrule, describeRrule, type RecurrenceSpec } from "@/lib/maintenance/rrule-builder";
import { nextOccurrences } from "@/lib/maintenance/recurrence";
import { WEEKDAY_CODES, type WeekdayCode } from "@/lib/maintenance/rrule-parse";

type Oven = { id: number; tag: string; timeZone: string };
type Shape = "daily" | "weekly" | "monthly-day" | "monthly-weekday" | "yearly";
type TriggerType = "calendar" | "runs" | "hours";

const control = "block w-full min-h-11 rounded-lg border border-paper-line bg-paper-raised px-3 py-2 text-base";
const DAY_LABEL: Record<WeekdayCode, string> = { MO: "Mon", TU: "Tue", WE: "Wed", TH: "Thu", FR: "Fri", SA: "Sat", SU: "Sun" };

function spec(shape: Shape, interval: number, weekdays: WeekdayCode[], dayOfMonth: number, ordinal: number, weekday: WeekdayCode): RecurrenceSpec {
  switch (shape) {
    case "daily": return { kind: "daily", interval };
    case "weekly": return { kind: "weekly", interval, weekdays };
    case "monthly-day": return { kind: "monthly-day", interval, dayOfMonth };
    case "monthly-weekday": return { kind: "monthly-weekday", interval, ordinal, weekday };
    case "yearly": return { kind: "yearly", interval };
  }
}

function fmt(d: Date, tz: string) {
  return new Intl.DateTimeFormat("en-GB", { timeZone: tz, weekday: "short", day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit", timeZoneName: "short" }).format(d);
}

export function PlanForm({ ovens }: { ovens: Oven[] }) {
  const router = useRouter();
  const today = new Date().toISOString().slice(0, 10);
  const [ovenIds, setOvenIds] = useState<number[]>([]);
  const [title, setTitle] = useState("");
  const [instructions, setInstructions] = useState("");
  const [kind, setKind] = useState<"preventive" | "calibration">("preventive");
  const [minutes, setMinutes] = useState("30");
  const [lockout, setLockout] = useState(true);
  const [checklist, setChecklist] = useState<{ label: string; mandatory: boolean }[]>([{ label: "", mandatory: true }]);
  const [trigger, setTrigger] = useState<TriggerType>("calendar");
  const [shape, setShape] = useState<Shape>("weekly");
  const [interval, setInterval] = useState(1);
  const [weekdays, setWeekdays] = useState<WeekdayCode[]>(["MO"]);
  const [dayOfMonth, setDayOfMonth] = useState(1);
  const [ordinal, setOrdinal] = useState(1);
  const [weekday, setWeekday] = useState<WeekdayCode>("MO");
  const [date, setDate] = useState(today);
  const [time, setTime] = useState("07:00");
  const [usage, setUsage] = useState("50");
  const [error, setError] = useState<{ message: string; fields?: Record<string, string> } | null>(null);
  const [busy, setBusy] = useState(false);
  const timeZone = ovens.find((o) => ovenIds.includes(o.id))?.timeZone ?? ovens[0]?.timeZone ?? "UTC";

  const preview = useMemo(() => {
    if (trigger !== "calendar") return null;
    try {
      const rrule = buildRrule(spec(shape, interval, weekdays, dayOfMonth, ordinal, weekday), { timeZone });
      const dtstartLocal = `${date}T${time}`;
      const next = nextOccurrences({ rrule, dtstartLocal, timeZone, after: new Date() }, 5);
      return { rrule, text: describeRrule(rrule, { timeZone }), next, dtstartLocal };
    } catch (e) {
      return { error: (e as Error).message };
    }
  }, [trigger, shape, interval, weekdays, dayOfMonth, ordinal, weekday, date, time, timeZone]);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    setError(null);
    const items = checklist.filter((c) => c.label.trim()).map((c, i) => ({ id: `item-${i + 1}`, label: c.label.trim(), mandatory: c.mandatory }));
    const triggerFields =
      trigger === "calendar" ? (preview && "rrule" in preview ? { rrule: preview.rrule, dtstart: preview.dtstartLocal } : { rrule: "" })
      : trigger === "runs" ? { everyRuns: Number(usage) } : { everyHeaterHours: Number(usage) };
    try {
      await apiFetch("/api/v1/plans", {
        method: "POST",
        json: { ovenIds, title, instructions, kind, estimatedMinutes: minutes ? Number(minutes) : undefined, safetyLockout: lockout, checklist: items, ...triggerFields },
      });
      router.push("/plans");
      router.refresh();
    } catch (err) {
      setError(err instanceof ApiError ? { message: err.message, fields: (err.details?.fields as Record<string, string>) ?? undefined } : { message: "Could not reach the server." });
      setBusy(false);
    }
  }

  return (
    <form onSubmit={submit} className="space-y-5" noValidate>
      <fieldset className="card p-4">
        <legend className="px-1 text-sm font-semibold">Ovens</legend>
        <div className="flex flex-wrap gap-2">
          {ovens.map((o) => (
            <label key={o.id} className="flex min-h-11 items-center gap-2 rounded-lg border border-paper-line px-3">
              <input type="checkbox" className="h-5 w-5" checked={ovenIds.includes(o.id)} onChange={(e) => setOvenIds((ids) => (e.target.checked ? [...ids, o.id] : ids.filter((x) => x !== o.id)))} />
              {o.tag}
            </label>
          ))}
        </div>
        {error?.fields?.ovenIds ? <p className="mt-1 text-sm text-health-act">Ovens: {error.fields.ovenIds}</p> : null}
      </fieldset>
      <div className="grid gap-4 sm:grid-cols-2">
        <label className="block text-sm font-medium text-ink-soft sm:col-span-2">Title<input className={control} value={title} onChange={(e) => setTitle(e.target.value)} /></label>
        <label className="block text-sm font-medium text-ink-soft">Kind
          <select className={control} value={kind} onChange={(e) => setKind(e.target.value as typeof kind)}><option value="preventive">Preventive</option><option value="calibration">Calibration</option></select>
        </label>
        <label className="block text-sm font-medium text-ink-soft">Estimated minutes<input inputMode="numeric" className={`${control} num`} value={minutes} onChange={(e) => setMinutes(e.target.value.replace(/\D/g, ""))} /></label>
        <label className="block text-sm font-medium text-ink-soft sm:col-span-2">Instructions<textarea className={`${control} min-h-24`} value={instructions} onChange={(e) => setInstructions(e.target.value)} /></label>
        <label className="flex min-h-11 items-center gap-2 text-sm sm:col-span-2"><input type="checkbox" className="h-5 w-5" checked={lockout} onChange={(e) => setLockout(e.target.checked)} /> Involves heaters, wiring, moving parts or the chamber (show the lock-out/tag-out caution)</label>
      </div>
      <fieldset className="card space-y-2 p-4">
        <legend className="px-1 text-sm font-semibold">Checklist</legend>
        {checklist.map((c, i) => (
          <div key={i} className="flex flex-wrap items-center gap-2">
            <input aria-label={`Checklist item ${i + 1}`} className={`${control} flex-1`} value={c.label} onChange={(e) => setChecklist((cs) => cs.map((x, j) => (j === i ? { ...x, label: e.target.value } : x)))} />
            <label className="flex min-h-11 items-center gap-2 text-sm"><input type="checkbox" className="h-5 w-5" checked={c.mandatory} onChange={(e) => setChecklist((cs) => cs.map((x, j) => (j === i ? { ...x, mandatory: e.target.checked } : x)))} /> required</label>
          </div>
        ))}
        <Button type="button" onClick={() => setChecklist((cs) => [...cs, { label: "", mandatory: true }])}>Add an item</Button>
      </fieldset>
      <fieldset className="card space-y-3 p-4">
        <legend className="px-1 text-sm font-semibold">When it falls due</legend>
        <div className="flex flex-wrap gap-2" role="radiogroup" aria-label="Trigger">
          {([["calendar", "On the calendar"], ["runs", "Every N verification runs"], ["hours", "Every N heater hours"]] as const).map(([v, l]) => (
            <label key={v} className="flex min-h-11 items-center gap-2 rounded-lg border border-paper-line px-3 text-sm"><input type="radio" name="trigger" checked={trigger === v} onChange={() => setTrigger(v)} /> {l}</label>
          ))}
        </div>
        {trigger === "calendar" ? (
          <div className="grid gap-3 sm:grid-cols-3">
            <label className="block text-sm">Repeats
              <select className={control} value={shape} onChange={(e) => setShape(e.target.value as Shape)}>
                <option value="daily">Every N days</option><option value="weekly">Every N weeks, on weekdays</option>
                <option value="monthly-day">Every N months, on a day</option><option value="monthly-weekday">Every N months, on the n-th weekday</option><option value="yearly">Every N years</option>
              </select>
            </label>
            <label className="block text-sm">N<input type="number" min={1} className={`${control} num`} value={interval} onChange={(e) => setInterval(Math.max(1, Number(e.target.value) || 1))} /></label>
            {shape === "monthly-day" ? <label className="block text-sm">Day of month<input type="number" min={-1} max={31} className={`${control} num`} value={dayOfMonth} onChange={(e) => setDayOfMonth(Number(e.target.value))} /></label> : null}
            {shape === "monthly-weekday" ? (
              <div className="grid grid-cols-2 gap-2">
                <label className="block text-sm">Which<select className={control} value={ordinal} onChange={(e) => setOrdinal(Number(e.target.value))}><option value={1}>1st</option><option value={2}>2nd</option><option value={3}>3rd</option><option value={4}>4th</option><option value={-1}>last</option></select></label>
                <label className="block text-sm">Weekday<select className={control} value={weekday} onChange={(e) => setWeekday(e.target.value as WeekdayCode)}>{WEEKDAY_CODES.map((d) => <option key={d} value={d}>{DAY_LABEL[d]}</option>)}</select></label>
              </div>
            ) : null}
            {shape === "weekly" ? (
              <div className="flex flex-wrap gap-1 sm:col-span-3" role="group" aria-label="Weekdays">
                {WEEKDAY_CODES.map((d) => (
                  <button key={d} type="button" aria-pressed={weekdays.includes(d)} onClick={() => setWeekdays((w) => (w.includes(d) ? w.filter((x) => x !== d) : [...w, d]))} className={`min-h-11 min-w-11 rounded-lg border px-2 text-sm ${weekdays.includes(d) ? "border-ember bg-ember-soft text-ember-strong" : "border-paper-line"}`}>{DAY_LABEL[d]}</button>
                ))}
              </div>
            ) : null}
            <label className="block text-sm">Starting on<input type="date" className={control} value={date} onChange={(e) => setDate(e.target.value)} /></label>
            <label className="block text-sm">At (site time)<input type="time" className={control} value={time} onChange={(e) => setTime(e.target.value)} /></label>
          </div>
        ) : (
          <label className="block max-w-xs text-sm">{trigger === "runs" ? "Every N runs" : "Every N heater hours"}<input inputMode="decimal" className={`${control} num`} value={usage} onChange={(e) => setUsage(e.target.value)} /></label>
        )}
        {preview ? (
          <div className="rounded-lg bg-paper-sunk p-3 text-sm" aria-live="polite" data-testid="rrule-preview">
            {"error" in preview ? <p className="text-health-act">{preview.error}</p> : (
              <>
                <p className="font-medium">{preview.text}</p>
                <p className="mt-1 font-mono text-xs">RRULE:{preview.rrule}</p>
                <p className="mt-2 text-xs font-semibold uppercase tracking-wide text-ink-muted">Next five, in {timeZone}</p>
                <ol className="num list-decimal pl-5">{preview.next.map((d) => <li key={d.toISOString()}>{fmt(d, timeZone)}</li>)}</ol>
              </>
            )}
          </div>
        ) : null}
      </fieldset>
      {error ? <p role="alert" className="text-sm text-health-act">{error.message}</p> : null}
      <Button type="submit" variant="primary" disabled={busy}>{busy ? "Saving…" : "Save plan"}</Button>
    </form>
  );
}
