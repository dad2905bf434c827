import { useQuery } from '@tanstack/react-query';
import type { HeatmapField, RouteView } from '@shared/api/audits.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { Spinner } from '@/components/ui/spinner.js';
import { heatmapUrl } from '../api/download-urls.js';
import { legendQueryOptions } from '../api/get-legend.js';
import { overlayQueryOptions } from '../api/get-overlay.js';
import { LegendBar } from './legend-bar.js';
import { OverlaySvg } from './overlay-svg.js';

const SIZE_PX = 512;

/** One candidate in the compare view: its heatmap with the vector overlay on top, and the legend. */
export function HeatmapPanel({ auditId, candidateId, label, field, route }: { auditId: number; candidateId: number; label: string; field: HeatmapField; route?: RouteView }) {
  const overlay = useQuery(overlayQueryOptions(auditId, candidateId));
  const legend = useQuery(legendQueryOptions(auditId, candidateId, field));
  return (
    <figure className="flex flex-col gap-3" data-candidate-id={candidateId}>
      <figcaption className="text-sm font-semibold text-ink-950">{label}</figcaption>
      <div className="relative aspect-square w-full overflow-hidden rounded-md border border-rule bg-white">
        <img
          src={heatmapUrl(auditId, candidateId, field, SIZE_PX)}
          alt={`${legend.data?.label ?? field} of ${label} over the region`}
          width={SIZE_PX}
          height={SIZE_PX}
          className="absolute inset-0 h-full w-full"
        />
        {overlay.data && <OverlaySvg overlay={overlay.data} route={route} label={`Outline, graticule and Tissot ellipses of ${label}`} />}
        {overlay.isPending && (
          <div className="absolute top-2 right-2">
            <Spinner label="Drawing the overlay" />
          </div>
        )}
      </div>
      {overlay.isError && <Alert tone="error">{overlay.error.message}</Alert>}
      {legend.data && <LegendBar legend={legend.data} />}
      <a className="text-xs text-mulberry-700 underline" href={heatmapUrl(auditId, candidateId, field, 2048)} download={`${label}-${field}.png`}>
        Download this heatmap (PNG, 2048 px)
      </a>
    </figure>
  );
}
