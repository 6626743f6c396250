"use client";
import { useActionState, useTransition, type FormEvent } from "react";

/**
 * Binds a form to a server action without React's automatic form reset, so a rejected
 * submission keeps what the person typed and only the errors appear beside the fields.
 */
export function useFormAction<S>(action: (prev: S | null, form: FormData) => Promise<S>) {
  const [state, submit] = useActionState(action, null);
  const [pending, startTransition] = useTransition();
  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    startTransition(() => submit(data));
  };
  return { state, onSubmit, pending };
}
