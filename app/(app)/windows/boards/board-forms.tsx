"use client";
import { ActionForm } from "@/components/ui/action-form";
import { Button } from "@/components/ui/button";
import { TextAreaField, TextField } from "@/components/ui/field";
import { createBoardAction } from "../actions";

const EXAMPLE = JSON.stringify([{ label: "P1", x: 12, y: 10, sitsOn: "board edge near connector" }, { label: "P2", x: 80, y: 50, sitsOn: "large QFN centre" }], null, 1);

export function NewBoardForm() {
  return (
    <ActionForm action={createBoardAction} className="space-y-3">
      {({ fields, pending }) => (
        <>
          <TextField label="Name" name="name" error={fields?.name} />
          <div className="grid grid-cols-2 gap-3">
            <TextField label="Width (mm)" name="widthMm" inputMode="decimal" error={fields?.widthMm} />
            <TextField label="Height (mm)" name="heightMm" inputMode="decimal" error={fields?.heightMm} />
          </div>
          <TextAreaField
            label="Probe positions (JSON)"
            name="probes"
            defaultValue={EXAMPLE}
            hint="A list of probes: label, x and y in mm from the top-left corner, and what the probe sits on."
            error={fields?.probes ?? Object.entries(fields ?? {}).find(([k]) => k.startsWith("probes."))?.[1]}
          />
          <Button type="submit" variant="primary" disabled={pending}>Add test board</Button>
        </>
      )}
    </ActionForm>
  );
}
