/**
 * Benchfold's mark: a sheet with its corner folded, carrying a fundamental and,
 * beneath it in the signal colour, its octave (twice the frequency).
 */
type LogoMarkProps = { size?: number; className?: string; title?: string };

export function LogoMark({ size = 28, className, title }: LogoMarkProps) {
  return (
    <svg
      width={size}
      height={size}
      viewBox="0 0 32 32"
      fill="none"
      className={className}
      role={title ? "img" : undefined}
      aria-hidden={title ? undefined : true}
      aria-label={title}
    >
      <path d="M6.5 2.75h13.75l5.5 5.5v21H6.5z" fill="var(--color-paper-bright)" stroke="currentColor" strokeWidth="1.75" strokeLinejoin="round" />
      <path d="M20.25 2.75v5.5h5.5" stroke="currentColor" strokeWidth="1.75" strokeLinejoin="round" />
      <path d="M9.75 15.5c1.6-3.6 4.9-3.6 6.5 0s4.9 3.6 6.5 0" stroke="currentColor" strokeWidth="1.75" strokeLinecap="round" />
      <path
        d="M9.75 23c.8-2.6 2.45-2.6 3.25 0s2.45 2.6 3.25 0 2.45-2.6 3.25 0 2.45 2.6 3.25 0"
        stroke="var(--color-signal)"
        strokeWidth="1.75"
        strokeLinecap="round"
      />
    </svg>
  );
}

export function Logo({ className }: { className?: string }) {
  return (
    <span className={`inline-flex items-center gap-2 text-ink ${className ?? ""}`}>
      <LogoMark size={28} />
      <span className="text-[1.3rem] font-semibold leading-none tracking-[0.01em]">Benchfold</span>
    </span>
  );
}
