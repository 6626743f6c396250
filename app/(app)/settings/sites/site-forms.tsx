"use client";
import { ActionForm } from "@/components/ui/action-form";
import { Button } from "@/components/ui/button";
import { SelectField, TextField } from "@/components/ui/field";
import { createLineAction, createSiteAction } from "../actions";

export function SiteForm() {
  return (
    <ActionForm action={createSiteAction} className="card grid gap-3 p-5 sm:grid-cols-[1fr_1fr_auto] sm:items-end">
      {({ fields, pending }) => (
        <>
          <TextField label="Site name" name="name" error={fields?.name} />
          <TextField label="Time zone" name="timeZone" placeholder="Europe/Dublin" hint="IANA name; schedules and dates follow it." error={fields?.timeZone} />
          <Button variant="primary" type="submit" disabled={pending}>
            Add site
          </Button>
        </>
      )}
    </ActionForm>
  );
}

export function LineForm({ sites }: { sites: { id: number; name: string }[] }) {
  return (
    <ActionForm action={createLineAction} className="card grid gap-3 p-5 sm:grid-cols-[1fr_1fr_10rem_auto] sm:items-end">
      {({ fields, pending }) => (
        <>
          <SelectField label="Site" name="siteId" error={fields?.siteId}>
            {sites.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
              </option>
            ))}
          </SelectField>
          <TextField label="Line name" name="name" error={fields?.name} />
          <SelectField label="Kind" name="kind" defaultValue="smt" error={fields?.kind}>
            <option value="smt">SMT line</option>
            <option value="lab">Lab</option>
            <option value="other">Other</option>
          </SelectField>
          <Button variant="primary" type="submit" disabled={pending}>
            Add line
          </Button>
        </>
      )}
    </ActionForm>
  );
}
