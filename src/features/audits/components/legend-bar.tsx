import type { LegendView } from '@shared/api/audits.schema.js';

/** A heatmap's legend from the server's stops: a gradient bar with values under it. */
export function LegendBar({ legend }: { legend: LegendView }) {
  const gradient = `linear-gradient(to right, ${legend.stops.map((s) => `${s.color} ${s.t * 100}%`).join(', ')})`;
  const labelled = legend.stops.filter((_, i) => i % 2 === 0);
  return (
    <figure className="flex flex-col gap-1" aria-label={`Legend: ${legend.label}`}>
      <figcaption className="text-xs text-ink-600">
        {legend.label} ({legend.units}){legend.scale === 'log' ? ', log scale' : ''}
      </figcaption>
      <div className="h-3 rounded-sm ring-1 ring-rule" style={{ backgroundImage: gradient }} />
      <div className="flex justify-between text-[11px] text-ink-600 tabular">
        {labelled.map((s) => (
          <span key={s.t}>{s.text}</span>
        ))}
      </div>
    </figure>
  );
}
