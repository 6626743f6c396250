import type { ButtonHTMLAttributes } from "react";

type Variant = "primary" | "secondary" | "danger" | "ghost";

const VARIANTS: Record<Variant, string> = {
  primary: "bg-ember text-white hover:bg-ember-strong border border-ember-strong",
  secondary: "bg-paper-raised text-ink hover:bg-paper-sunk border border-paper-line",
  danger: "bg-paper-raised text-health-act hover:bg-red-50 border border-health-act/40",
  ghost: "bg-transparent text-ink-soft hover:bg-paper-sunk border border-transparent",
};

/** Class names for a button-looking element, so links and buttons share one look. */
export function buttonClass(variant: Variant = "secondary", extra = "") {
  return `inline-flex min-h-11 items-center justify-center gap-2 rounded-lg px-4 text-sm font-semibold transition-colors disabled:cursor-not-allowed disabled:opacity-50 ${VARIANTS[variant]} ${extra}`;
}

export function Button({ variant = "secondary", className = "", ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return <button className={buttonClass(variant, className)} {...props} />;
}
