"use client";
import { ActionForm } from "@/components/ui/action-form";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/field";
import { acknowledgeAlertAction } from "./actions";

export function AcknowledgeForm({ alertId, canOpenWorkOrder }: { alertId: number; canOpenWorkOrder: boolean }) {
  return (
    <ActionForm action={acknowledgeAlertAction} className="mt-3 grid gap-2 sm:grid-cols-[1fr_auto_auto] sm:items-end">
      {({ fields, pending }) => (
        <>
          <input type="hidden" name="alertId" value={alertId} />
          <TextField label="Note" name="note" id={`note-${alertId}`} placeholder="What you found or did" error={fields?.note} />
          {canOpenWorkOrder ? (
            <label className="flex min-h-11 items-center gap-2 text-sm">
              <input type="checkbox" name="openWorkOrder" className="h-5 w-5" /> Open a drift investigation
            </label>
          ) : (
            <span />
          )}
          <Button type="submit" variant="primary" disabled={pending}>
            Acknowledge
          </Button>
        </>
      )}
    </ActionForm>
  );
}
