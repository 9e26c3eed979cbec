/** Compline's mark: three sales and the line fitted through them. The same drawing as favicon.svg. */
export function BrandMark({ size = 28, className = '' }: { size?: number; className?: string }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden className={className}>
      <rect width="32" height="32" rx="7" fill="var(--color-ink)" />
      <path d="M5.5 24 26.5 9" stroke="var(--color-ochre)" strokeWidth="2.6" strokeLinecap="round" />
      <circle cx="10" cy="23.4" r="2.5" fill="var(--color-paper)" />
      <circle cx="16.2" cy="13.6" r="2.5" fill="var(--color-paper)" />
      <circle cx="22.4" cy="15.4" r="2.5" fill="var(--color-paper)" />
    </svg>
  );
}

export function Wordmark({ className = '' }: { className?: string }) {
  return (
    <span className={`inline-flex items-center gap-2.5 ${className}`}>
      <BrandMark />
      <span className="text-[1.1875rem] font-bold tracking-[-0.02em] text-ink">Compline</span>
    </span>
  );
}
