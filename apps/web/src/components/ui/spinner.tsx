import { cx } from '../../lib/cx';

export function Spinner({ className }: { className?: string }) {
  return (
    <span
      aria-hidden="true"
      className={cx(
        'inline-block size-4 animate-spin rounded-full border-2 border-current border-r-transparent align-[-2px]',
        className,
      )}
    />
  );
}

export function PageLoading({ label = 'Loading' }: { label?: string }) {
  return (
    <div role="status" className="flex min-h-[40vh] items-center justify-center gap-3 text-sm text-ink-muted">
      <Spinner />
      <span>{label}…</span>
    </div>
  );
}
