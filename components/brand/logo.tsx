// Ovenward's mark: an oven chamber with one rising profile line through it.
export function OvenwardMark({ size = 28, title }: { size?: number; title?: string }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" role={title ? "img" : undefined} aria-hidden={title ? undefined : true} aria-label={title}>
      <rect x="3" y="6" width="26" height="20" rx="3" fill="none" stroke="#1c2126" strokeWidth="2.5" />
      <path d="M3 21 L10 19 L15 14 L19 13 L23 9 L29 15" fill="none" stroke="#c2410c" strokeWidth="2.5" strokeLinecap="round" strokeLinejoin="round" />
    </svg>
  );
}

export function OvenwardLogo({ className = "" }: { className?: string }) {
  return (
    <span className={`inline-flex items-center gap-2 font-semibold tracking-wide text-ink ${className}`}>
      <OvenwardMark />
      <span className="text-lg">Ovenward</span>
    </span>
  );
}
