import type { InputHTMLAttributes, ReactNode, SelectHTMLAttributes, TextareaHTMLAttributes } from "react";

const control =
  "block w-full min-h-11 rounded-lg border border-paper-line bg-paper-raised px-3 py-2 text-base text-ink placeholder:text-ink-faint focus:border-ember-ring aria-[invalid=true]:border-health-act";

type Common = { label: string; name: string; id?: string; error?: string; hint?: ReactNode };

function Wrap({ label, name: fieldName, id, error, hint, children }: Common & { children: ReactNode }) {
  // Ids default to the field's name; two forms on one page pass their own id.
  const name = id ?? fieldName;
  return (
    <div className="space-y-1">
      <label htmlFor={name} className="block text-sm font-medium text-ink-soft">
        {label}
      </label>
      {children}
      {hint && !error ? <p id={`${name}-hint`} className="text-xs text-ink-muted">{hint}</p> : null}
      {error ? (
        <p id={`${name}-error`} className="text-sm text-health-act" role="alert">
          {label}: {error}
        </p>
      ) : null}
    </div>
  );
}

const describedBy = (name: string, error?: string, hint?: ReactNode) => (error ? `${name}-error` : hint ? `${name}-hint` : undefined);

export function TextField({ label, name, id, error, hint, ...rest }: Common & InputHTMLAttributes<HTMLInputElement>) {
  const key = id ?? name;
  return (
    <Wrap label={label} name={name} id={key} error={error} hint={hint}>
      <input id={key} name={name} className={control} aria-invalid={error ? true : undefined} aria-describedby={describedBy(key, error, hint)} {...rest} />
    </Wrap>
  );
}

export function SelectField({ label, name, id, error, hint, children, ...rest }: Common & SelectHTMLAttributes<HTMLSelectElement>) {
  const key = id ?? name;
  return (
    <Wrap label={label} name={name} id={key} error={error} hint={hint}>
      <select id={key} name={name} className={control} aria-invalid={error ? true : undefined} aria-describedby={describedBy(key, error, hint)} {...rest}>
        {children}
      </select>
    </Wrap>
  );
}

export function TextAreaField({ label, name, id, error, hint, ...rest }: Common & TextareaHTMLAttributes<HTMLTextAreaElement>) {
  const key = id ?? name;
  return (
    <Wrap label={label} name={name} id={key} error={error} hint={hint}>
      <textarea id={key} name={name} className={`${control} min-h-24`} aria-invalid={error ? true : undefined} aria-describedby={describedBy(key, error, hint)} {...rest} />
    </Wrap>
  );
}

export function FormMessage({ result }: { result: { ok: boolean; message?: string } | null | undefined }) {
  if (!result || !result.message) return null;
  return (
    <p role={result.ok ? "status" : "alert"} className={`rounded-lg border px-3 py-2 text-sm ${result.ok ? "border-health-steady/40 bg-teal-50 text-health-steady" : "border-health-act/40 bg-red-50 text-health-act"}`}>
      {result.message}
    </p>
  );
}
