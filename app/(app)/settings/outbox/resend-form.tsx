"use client";
import { ActionForm } from "@/components/ui/action-form";
import { Button } from "@/components/ui/button";
import { resendOutboxAction } from "./actions";

export function ResendForm({ id, subject }: { id: number; subject: string }) {
  return (
    <ActionForm action={resendOutboxAction} className="flex flex-col items-end gap-1">
      {({ pending }) => (
        <>
          <input type="hidden" name="outboxId" value={id} />
          <Button type="submit" disabled={pending} aria-label={`Resend “${subject}”`}>
            Resend
          </Button>
        </>
      )}
    </ActionForm>
  );
}
