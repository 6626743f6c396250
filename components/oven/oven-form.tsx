"use client";
import { useActionState, useTransition } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { Button } from "@/components/ui/button";
import { FormMessage, SelectField, TextAreaField, TextField } from "@/components/ui/field";
import { ovenCreateSchema, OVEN_KIND_LABELS, OVEN_KIND_VALUES, SERVICE_STATE_LABELS } from "@/lib/validation/oven";
import type { ActionResult } from "@/lib/action";

type Values = Record<string, string>;
type LineOption = { id: number; label: string };

/** The oven form, for adding and editing. Checked in the browser with the same schema the server uses. */
export function OvenForm({
  action,
  lines,
  initial,
  ovenId,
  canRetire,
}: {
  action: (prev: ActionResult<{ id: number }> | null, form: FormData) => Promise<ActionResult<{ id: number }>>;
  lines: LineOption[];
  initial?: Values;
  ovenId?: number;
  canRetire: boolean;
}) {
  const [state, submit] = useActionState(action, null);
  const [pending, startTransition] = useTransition();
  const form = useForm<Values>({
    resolver: zodResolver(ovenCreateSchema) as never,
    defaultValues: { kind: "convection", serviceState: "in_service", zones: "", lineId: lines[0] ? String(lines[0].id) : "", ...initial },
    mode: "onBlur",
  });
  const serverFields = state && !state.ok ? state.fields : undefined;
  const err = (name: string) => (form.formState.errors[name]?.message as string | undefined) ?? serverFields?.[name];

  const onValid = (_: unknown, event?: React.BaseSyntheticEvent) => {
    const data = new FormData(event?.target as HTMLFormElement);
    startTransition(() => submit(data));
  };

  const states = canRetire ? (["in_service", "down", "retired"] as const) : (["in_service", "down"] as const);
  return (
    <form onSubmit={form.handleSubmit(onValid)} className="card grid gap-4 p-5 sm:grid-cols-2" noValidate>
      {ovenId ? <input type="hidden" name="ovenId" value={ovenId} /> : null}
      <TextField label="Tag" hint="Unique in the plant, e.g. L2-RF1. Printed on the QR label." error={err("tag")} {...form.register("tag")} />
      <TextField label="Name" error={err("name")} {...form.register("name")} />
      <SelectField label="Line" error={err("lineId")} {...form.register("lineId")}>
        {lines.map((l) => (
          <option key={l.id} value={l.id}>
            {l.label}
          </option>
        ))}
      </SelectField>
      <SelectField label="Kind" error={err("kind")} {...form.register("kind")}>
        {OVEN_KIND_VALUES.map((k) => (
          <option key={k} value={k}>
            {OVEN_KIND_LABELS[k]}
          </option>
        ))}
      </SelectField>
      <TextField label="Heating zones" type="number" inputMode="numeric" min={1} max={30} error={err("zones")} {...form.register("zones")} />
      <SelectField label="Service state" error={err("serviceState")} {...form.register("serviceState")}>
        {states.map((s) => (
          <option key={s} value={s}>
            {SERVICE_STATE_LABELS[s]}
          </option>
        ))}
      </SelectField>
      <TextField label="Maker" error={err("maker")} {...form.register("maker")} />
      <TextField label="Model" error={err("model")} {...form.register("model")} />
      <TextField label="Serial number" error={err("serial")} {...form.register("serial")} />
      <TextField label="Installed on" type="date" error={err("installedOn")} {...form.register("installedOn")} />
      <div className="sm:col-span-2">
        <TextAreaField label="Notes" error={err("notes")} {...form.register("notes")} />
      </div>
      <div className="flex flex-wrap items-center gap-3 sm:col-span-2">
        <Button variant="primary" type="submit" disabled={pending}>
          {pending ? "Saving…" : ovenId ? "Save changes" : "Add the oven"}
        </Button>
        {state && !state.ok ? <FormMessage result={state} /> : null}
      </div>
    </form>
  );
}
