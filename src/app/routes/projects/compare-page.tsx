import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router';
import { HEATMAP_FIELDS, type HeatmapField } from '@shared/api/audits.schema.js';
import { PageHeader } from '@/components/layouts/page-header.js';
import { Alert } from '@/components/ui/alert.js';
import { Card, CardBody } from '@/components/ui/card.js';
import { Spinner } from '@/components/ui/spinner.js';
import { auditQueryOptions } from '@/features/audits/api/get-audit.js';
import { overlayQueryOptions } from '@/features/audits/api/get-overlay.js';
import { CompareColumn } from '@/features/audits/components/compare-column.js';
import { RouteForm } from '@/features/audits/components/route-form.js';
import type { MemberPage } from '../../route-types.js';

const FIELD_LABELS: Record<HeatmapField, string> = {
  'areal-scale': 'Areal scale',
  'angular-deformation': 'Angular deformation',
  'scale-error': 'Scale error',
};

const GRID: Record<number, string> = { 2: 'md:grid-cols-2', 3: 'lg:grid-cols-3', 4: 'md:grid-cols-2 2xl:grid-cols-4' };
const ids = (text: string | null) => (text ?? '').split(',').map(Number).filter((n) => Number.isInteger(n) && n > 0);
const place = (lon: number, lat: number) => `${lon.toFixed(2)},${lat.toFixed(2)}`;

/** 2–4 candidates of one audit side by side: heatmaps with overlays, legends and two routes. */
function ComparePage() {
  const projectId = Number(useParams().projectId);
  const [params] = useSearchParams();
  const auditId = Number(params.get('audit'));
  const candidateIds = ids(params.get('candidates')).slice(0, 4);
  const [field, setField] = useState<HeatmapField>('areal-scale');
  const [route, setRoute] = useState<{ from: string; to: string } | null>(null);
  const audit = useQuery({ ...auditQueryOptions(auditId), enabled: auditId > 0 });
  // The first candidate's ellipses span the region: its west- and eastmost make a default route.
  const firstOverlay = useQuery({ ...overlayQueryOptions(auditId, candidateIds[0] ?? 0), enabled: auditId > 0 && candidateIds.length > 0 });

  const back = (
    <Link to={`/projects/${projectId}`} className="text-sm text-mulberry-700 underline">
      Back to the project
    </Link>
  );
  if (!(auditId > 0) || candidateIds.length < 2) {
    return (
      <>
        <PageHeader title="Compare candidates" actions={back} />
        <Alert tone="warning" title="Nothing to compare yet">Choose two to four candidates of a finished audit from the project’s Audits tab.</Alert>
      </>
    );
  }
  if (audit.isPending) return <Spinner label="Loading the audit" />;
  if (audit.isError) return <Alert tone="error" title="The audit could not be loaded">{audit.error.message}</Alert>;
  const labels = new Map(audit.data.scorecards.map((c) => [c.candidateId, c.label]));
  const tissot = firstOverlay.data?.tissot ?? [];
  const west = tissot.reduce((a, b) => (b.lonDeg < a.lonDeg ? b : a), tissot[0]);
  const east = tissot.reduce((a, b) => (b.lonDeg > a.lonDeg ? b : a), tissot[0]);

  return (
    <>
      <PageHeader title="Compare candidates" description={`Audit ${auditId} · ${candidateIds.length} candidates`} actions={back} />
      <Card className="mb-6">
        <CardBody className="flex flex-col gap-4">
          <fieldset className="flex flex-wrap items-center gap-2">
            <legend className="mb-2 text-sm font-medium text-ink-950">Field shown</legend>
            {HEATMAP_FIELDS.map((f) => (
              <label key={f} className="flex cursor-pointer items-center gap-2 rounded-md border border-rule px-3 py-1.5 text-sm has-[:checked]:border-mulberry-600 has-[:checked]:bg-mulberry-50">
                <input type="radio" name="field" value={f} checked={field === f} onChange={() => setField(f)} />
                {FIELD_LABELS[f]}
              </label>
            ))}
          </fieldset>
          {west && east ? (
            <RouteForm initialFrom={place(west.lonDeg, west.latDeg)} initialTo={place(east.lonDeg, east.latDeg)} onDraw={(from, to) => setRoute({ from, to })} />
          ) : (
            firstOverlay.isPending && <Spinner label="Preparing" />
          )}
        </CardBody>
      </Card>
      <div className={`grid gap-6 ${GRID[candidateIds.length] ?? GRID[2]}`}>
        {candidateIds.map((id) => (
          <CompareColumn key={id} auditId={auditId} candidateId={id} label={labels.get(id) ?? `Candidate ${id}`} field={field} route={route} />
        ))}
      </div>
      <p className="mt-6 text-xs text-ink-600">
        Crosses mark the worst samples; ellipses are Tissot indicatrices at a lattice of places, drawn to one scale per map. Measure areas and
        distances on the ellipsoid, not from the map.
      </p>
    </>
  );
}

export const comparePage: MemberPage = {
  path: 'projects/:projectId/compare',
  Component: ComparePage,
  load: ({ queryClient, request }) => {
    const auditId = Number(new URL(request.url).searchParams.get('audit'));
    return auditId > 0 ? queryClient.ensureQueryData(auditQueryOptions(auditId)).catch(() => null) : null;
  },
};
