"use client";
import type { ReactNode } from "react";
import { useFormAction } from "./use-form-action";
import { FormMessage } from "./field";
import type { ActionResult } from "@/lib/action";

type Action = (prev: ActionResult<unknown> | null, form: FormData) => Promise<ActionResult<unknown> & { message?: string }>;

/**
 * A form bound to a server action, showing the result next to it. `children` receives the
 * field errors so each problem is said beside its field.
 */
export function ActionForm({
  action,
  children,
  className,
  render,
}: {
  action: Action;
  className?: string;
  children: (state: { fields?: Record<string, string>; pending: boolean }) => ReactNode;
  render?: (result: ActionResult<unknown>) => ReactNode;
}) {
  const { state, onSubmit, pending } = useFormAction(action);
  const fields = state && !state.ok ? state.fields : undefined;
  return (
    <form onSubmit={onSubmit} className={className} noValidate>
      {children({ fields, pending })}
      {state && (!state.ok ? !fields : true) ? <FormMessage result={state} /> : null}
      {state && render ? render(state) : null}
    </form>
  );
}
