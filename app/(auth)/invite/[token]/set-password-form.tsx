"use client";
import { useFormAction } from "@/components/ui/use-form-action";
import { Button } from "@/components/ui/button";
import { FormMessage, TextField } from "@/components/ui/field";
import { acceptInviteAction } from "./actions";

export function SetPasswordForm({ token }: { token: string }) {
  const { state, onSubmit, pending } = useFormAction(acceptInviteAction);
  const fields = state && !state.ok ? state.fields : undefined;
  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <input type="hidden" name="token" value={token} />
      <TextField label="New password" name="password" type="password" autoComplete="new-password" hint="At least 10 characters." error={fields?.password} />
      <TextField label="The same password again" name="confirm" type="password" autoComplete="new-password" error={fields?.confirm} />
      {state && !state.ok && !fields ? <FormMessage result={state} /> : null}
      <Button variant="primary" type="submit" disabled={pending} className="w-full">
        Set password
      </Button>
    </form>
  );
}
