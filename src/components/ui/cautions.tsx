import { cn } from '@/lib/cn.js';

/** The limits of what Warpmeter's figures mean, shown wherever results can be seen or exported. */
export const CAUTIONS: readonly string[] = [
  'Not for navigation.',
  'Boundaries are drawn for illustration only and imply no position on the legal status of any territory or on the course of any border.',
  'Measure areas and distances on the ellipsoid, never by scaling them off a projected map.',
  'The figures describe how the projection distorts the sampled region; they say nothing about how accurate the source boundaries are.',
  "For legal, cadastral or engineering work, follow the client's own standards and the advice of a licensed surveyor.",
];

interface CautionsProps {
  /** Footer style: small and muted. */
  compact?: boolean;
  /** Two columns on wide screens (for a full-width footer). */
  columns?: boolean;
  className?: string;
}

export function Cautions({ compact, columns, className }: CautionsProps) {
  return (
    <section aria-labelledby="cautions-heading" className={cn(compact ? 'text-xs text-ink-600' : 'text-sm text-ink-800', className)}>
      <h2 id="cautions-heading" className={cn('font-semibold text-ink-800', compact ? 'mb-1 text-xs' : 'mb-2 text-sm')}>
        Before you rely on these figures
      </h2>
      <ul className={cn('list-disc marker:text-mulberry-300', compact ? 'grid gap-x-10 gap-y-0.5 pl-4' : 'space-y-1 pl-5', columns && 'md:grid-cols-2')}>
        {CAUTIONS.map((c) => (
          <li key={c}>{c}</li>
        ))}
      </ul>
    </section>
  );
}
