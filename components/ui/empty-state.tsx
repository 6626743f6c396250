import type { ReactNode } from "react";

export function EmptyState({ title, children, action }: { title: string; children?: ReactNode; action?: ReactNode }) {
  return (
    <div className="card flex flex-col items-start gap-2 border-dashed p-6">
      <h3 className="text-base font-semibold text-ink">{title}</h3>
      {children ? <div className="max-w-prose text-sm text-ink-muted">{children}</div> : null}
      {action}
    </div>
  );
}
