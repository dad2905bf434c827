import { useQuery } from '@tanstack/react-query';
import { Spinner } from '@/components/ui/spinner.js';
import { overlayQueryOptions } from '@/features/audits/api/get-overlay.js';

const path = (line: [number, number][]) => line.map(([x, y], i) => `${i ? 'L' : 'M'}${x.toFixed(1)} ${y.toFixed(1)}`).join('');

/** The mapped region with its graticule, drawn in one shortlisted candidate's projection. */
export function RegionPreview({ auditId, candidateId, label }: { auditId: number; candidateId: number; label: string }) {
  const outline = useQuery(overlayQueryOptions(auditId, candidateId));
  if (outline.isPending) return <Spinner label="Drawing the region…" />;
  if (outline.isError) return <p className="text-sm text-ink-600">The region preview is not available.</p>;
  const o = outline.data;
  return (
    <figure className="flex flex-col gap-2">
      <svg viewBox={`0 0 ${o.viewBoxSize} ${o.viewBoxSize}`} className="aspect-square w-full max-w-sm rounded-md border border-rule bg-paper" role="img" aria-label={`The region drawn in ${label}`}>
        <g fill="none" stroke="var(--color-ink-500)" strokeOpacity=".45" strokeWidth="1.5">
          {o.graticule.lines.flatMap((l) => l.parts.map((p, i) => <path key={`${l.kind}${l.valueDeg}-${i}`} d={path(p)} />))}
        </g>
        <g fill="var(--color-mulberry-100)" fillRule="evenodd" stroke="var(--color-mulberry-700)" strokeWidth="3">
          <path d={o.outline.map((ring) => `${path(ring)}Z`).join('')} />
        </g>
      </svg>
      <figcaption className="text-xs text-ink-600">
        The region in {label}, with a graticule every {o.graticule.intervalDeg}°.
      </figcaption>
    </figure>
  );
}
