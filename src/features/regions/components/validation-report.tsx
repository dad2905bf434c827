import type { RegionReport } from '@shared/api/regions.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { formatAreaKm2 } from '@/features/projects/components/project-options.js';

const deg = (v: number) => `${Math.abs(v).toFixed(3)}°`;
const lon = (v: number) => `${deg(v)}${v < 0 ? 'W' : v > 0 ? 'E' : ''}`;
const lat = (v: number) => `${deg(v)}${v < 0 ? 'S' : v > 0 ? 'N' : ''}`;
const n = (v: number) => new Intl.NumberFormat().format(v);

/** What validation measured in the region and what it fixed on the way in. */
export function ValidationReport({ report }: { report: RegionReport }) {
  const [w, s, e, north] = report.bbox;
  const fixes = [
    report.ringsRewound && `${n(report.ringsRewound)} ring(s) turned to counter-clockwise order`,
    report.ringsClosed && `${n(report.ringsClosed)} open ring(s) closed`,
    report.duplicatePointsRemoved && `${n(report.duplicatePointsRemoved)} repeated point(s) removed`,
    report.degenerateRingsDropped && `${n(report.degenerateRingsDropped)} ring(s) without area dropped`,
    report.ringsSplitAtAntimeridian && `${n(report.ringsSplitAtAntimeridian)} ring(s) split at ±180°`,
    report.polarRingsClosed && `${n(report.polarRingsClosed)} ring(s) closed through the pole`,
  ].filter(Boolean) as string[];
  const rows: [string, string][] = [
    ['Geodesic area (WGS84)', formatAreaKm2(report.areaKm2)],
    ['Parts / holes', `${n(report.partCount)} / ${n(report.holeCount)}`],
    ['Vertices', n(report.vertexCount)],
    ['Extent', `${lon(w)} to ${lon(e)}, ${lat(s)} to ${lat(north)}`],
    ['Crosses ±180°', report.crossesAntimeridian ? 'yes' : 'no'],
    ['Contains a pole', report.poles.length ? report.poles.join(' and ') : 'no'],
    ['Self-intersections', report.selfIntersections.count ? n(report.selfIntersections.count) : 'none found'],
    ['Fixed on the way in', fixes.length ? fixes.join('; ') : 'nothing needed'],
  ];
  return (
    <div className="flex flex-col gap-3">
      <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1.5 text-sm" aria-label="Validation report">
        {rows.map(([k, v]) => (
          <div key={k} className="contents">
            <dt className="text-ink-600">{k}</dt>
            <dd className="text-ink-950 tabular">{v}</dd>
          </div>
        ))}
      </dl>
      {report.selfIntersections.count > 0 && (
        <Alert tone="warning" title="The boundary crosses itself">
          First at {report.selfIntersections.sample.slice(0, 3).map(([x, y]) => `${lon(x)} ${lat(y)}`).join('; ')}. Areas and samples near these
          points may be off; fix the boundary in a GIS if you can.
        </Alert>
      )}
      {report.notes.length > 0 && (
        <ul className="list-disc pl-5 text-sm text-ink-600">
          {report.notes.map((note) => (
            <li key={note}>{note}</li>
          ))}
        </ul>
      )}
    </div>
  );
}
