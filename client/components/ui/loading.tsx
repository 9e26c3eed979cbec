/** A quiet placeholder while a page's code or data is on its way. */
export function PageLoading({ fullPage = false, label = 'Loading…' }: { fullPage?: boolean; label?: string }) {
  return (
    <div role="status" aria-live="polite" className={fullPage ? 'flex min-h-dvh items-center justify-center' : 'flex items-center justify-center py-16'}>
      <div className="flex w-48 flex-col items-center gap-3">
        <LoadingBar />
        <span className="text-sm text-ink-faint">{label}</span>
      </div>
    </div>
  );
}

export function LoadingBar({ className = '' }: { className?: string }) {
  return (
    <span aria-hidden className={`relative block h-0.5 w-full overflow-hidden rounded-full bg-rule ${className}`}>
      <span className="animate-loading-sweep absolute inset-y-0 left-0 w-2/5 rounded-full bg-ink/70" />
    </span>
  );
}
