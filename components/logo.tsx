import { LOGO_PATHS } from "@/lib/design/logo";

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
      <path d={LOGO_PATHS.sheet} fill="var(--color-paper-bright)" stroke="currentColor" strokeWidth="1.75" strokeLinejoin="round" />
      <path d={LOGO_PATHS.fold} stroke="currentColor" strokeWidth="1.75" strokeLinejoin="round" />
      <path d={LOGO_PATHS.fundamental} stroke="currentColor" strokeWidth="1.75" strokeLinecap="round" />
      <path
        d={LOGO_PATHS.octave}
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
