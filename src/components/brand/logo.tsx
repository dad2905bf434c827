import markUrl from '@/assets/warpmeter-mark.svg';
import { cn } from '@/lib/cn.js';

/** The mark (a Tissot indicatrix stretched over a graticule) and, unless `markOnly`, the name. */
export function Logo({ markOnly, className, size = 28 }: { markOnly?: boolean; className?: string; size?: number }) {
  return (
    <span className={cn('inline-flex items-center gap-2', className)}>
      <img src={markUrl} width={size} height={size} alt={markOnly ? 'Warpmeter' : ''} className="shrink-0" />
      {!markOnly && <span className="text-lg font-semibold tracking-tight text-ink-950">Warpmeter</span>}
    </span>
  );
}
