import { useQuery } from '@tanstack/react-query';
import type { HeatmapField } from '@shared/api/audits.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { routeQueryOptions } from '../api/get-route.js';
import { HeatmapPanel } from './heatmap-panel.js';
import { RouteErrors } from './route-errors.js';

/** One candidate's column of the compare view: heatmap with overlays and, when asked, its route errors. */
export function CompareColumn(props: { auditId: number; candidateId: number; label: string; field: HeatmapField; route: { from: string; to: string } | null }) {
  const { auditId, candidateId, route } = props;
  const drawn = useQuery({ ...routeQueryOptions(auditId, candidateId, route?.from ?? '', route?.to ?? ''), enabled: Boolean(route) });
  return (
    <div className="flex min-w-0 flex-col gap-3">
      <HeatmapPanel auditId={auditId} candidateId={candidateId} label={props.label} field={props.field} route={route ? drawn.data : undefined} />
      {route && drawn.isError && <Alert tone="error">{drawn.error.message}</Alert>}
      {route && drawn.data && <RouteErrors route={drawn.data} />}
    </div>
  );
}
