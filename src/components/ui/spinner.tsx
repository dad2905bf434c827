import { cn } from '@/lib/cn.js';

/** A small turning ring. Pass `label` when the spinner is the only sign of progress on screen. */
export function Spinner({ label, className }: { label?: string; className?: string }) {
  return (
    <span className={cn('inline-flex items-center gap-2', className)} role={label ? 'status' : undefined}>
      <svg className="size-4 animate-spin" viewBox="0 0 16 16" aria-hidden="true">
        <circle cx="8" cy="8" r="6" fill="none" stroke="currentColor" strokeOpacity=".25" strokeWidth="2" />
        <path d="M8 2a6 6 0 0 1 6 6" fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
      </svg>
      {label && <span className="text-sm text-ink-600">{label}</span>}
    </span>
  );
}
