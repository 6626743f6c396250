"use client";
import { useFormAction } from "@/components/ui/use-form-action";
import { Button } from "@/components/ui/button";
import { FormMessage, TextField } from "@/components/ui/field";
import { magicLinkAction, passwordSignInAction } from "./actions";

export function PasswordForm({ next }: { next?: string }) {
  const { state, onSubmit, pending } = useFormAction(passwordSignInAction);
  const fields = state && !state.ok ? state.fields : undefined;
  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <input type="hidden" name="next" value={next ?? ""} />
      <TextField label="E-mail" name="email" type="email" autoComplete="username" required error={fields?.email} />
      <TextField label="Password" name="password" type="password" autoComplete="current-password" required error={fields?.password} />
      {state && !state.ok && !fields ? <FormMessage result={state} /> : null}
      <Button variant="primary" type="submit" disabled={pending} className="w-full">
        {pending ? "Signing in…" : "Sign in"}
      </Button>
    </form>
  );
}

export function MagicLinkForm({ next }: { next?: string }) {
  const { state, onSubmit, pending } = useFormAction(magicLinkAction);
  const fields = state && !state.ok ? state.fields : undefined;
  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <input type="hidden" name="next" value={next ?? ""} />
      <TextField label="E-mail for a sign-in link" name="email" id="magic-email" type="email" autoComplete="email" required error={fields?.email} />
      <Button type="submit" disabled={pending} className="w-full">
        {pending ? "Sending…" : "E-mail me a sign-in link"}
      </Button>
    </form>
  );
}
