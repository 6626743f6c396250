"use client";
import { ActionForm } from "@/components/ui/action-form";
import { Button } from "@/components/ui/button";
import { SelectField } from "@/components/ui/field";
import { deleteRunAction, rejudgeRunAction } from "./actions";

export function RejudgeForm({ runId, windows, currentWindowId }: { runId: number; windows: { id: number; name: string; version: number }[]; currentWindowId: number | null }) {
  return (
    <ActionForm action={rejudgeRunAction} className="space-y-3">
      {({ pending, fields }) => (
        <>
          <input type="hidden" name="runId" value={runId} />
          <SelectField label="Window to judge against" name="windowId" defaultValue={currentWindowId ?? ""} error={fields?.windowId}>
            {windows.map((w) => (
              <option key={w.id} value={w.id}>
                {w.name} (version {w.version})
              </option>
            ))}
          </SelectField>
          <Button type="submit" disabled={pending}>{pending ? "Judging…" : "Re-judge from the stored curves"}</Button>
        </>
      )}
    </ActionForm>
  );
}

export function DeleteRunForm({ runId, ovenId }: { runId: number; ovenId: number }) {
  return (
    <ActionForm action={deleteRunAction} className="space-y-2">
      {({ pending }) => (
        <>
          <input type="hidden" name="runId" value={runId} />
          <input type="hidden" name="ovenId" value={ovenId} />
          <p className="text-xs text-ink-muted">Deleting hides the run from lists and trends; the audit log keeps a record.</p>
          <Button type="submit" variant="danger" disabled={pending} onClick={(e) => { if (!confirm("Delete this run?")) e.preventDefault(); }}>
            Delete run
          </Button>
        </>
      )}
    </ActionForm>
  );
}
