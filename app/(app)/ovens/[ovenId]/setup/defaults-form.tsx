"use client";
import { ActionForm } from "@/components/ui/action-form";
import { Button } from "@/components/ui/button";
import { SelectField } from "@/components/ui/field";
import { setOvenDefaultsAction } from "./actions";

type Option = { id: number; label: string };

export function OvenDefaultsForm({ ovenId, windowId, boardId, windows, boards }: { ovenId: number; windowId: number | null; boardId: number | null; windows: Option[]; boards: Option[] }) {
  return (
    <ActionForm action={setOvenDefaultsAction} className="space-y-3">
      {({ fields, pending }) => (
        <>
          <input type="hidden" name="ovenId" value={ovenId} />
          <SelectField label="Default process window" name="defaultWindowId" defaultValue={windowId ?? ""} error={fields?.defaultWindowId}>
            <option value="">built-in SAC305 window</option>
            {windows.map((w) => <option key={w.id} value={w.id}>{w.label}</option>)}
          </SelectField>
          <SelectField label="Default test board" name="defaultBoardId" defaultValue={boardId ?? ""} error={fields?.defaultBoardId}>
            <option value="">none</option>
            {boards.map((b) => <option key={b.id} value={b.id}>{b.label}</option>)}
          </SelectField>
          <Button type="submit" disabled={pending}>Save defaults</Button>
        </>
      )}
    </ActionForm>
  );
}
