import type { ResolvedDefinitionView } from '@shared/api/candidates.schema.js';

const PARAM_LABELS: Record<string, string> = {
  lat0Deg: 'Latitude of origin',
  lon0Deg: 'Central meridian',
  lat1Deg: 'Standard parallel 1',
  lat2Deg: 'Standard parallel 2',
  latTsDeg: 'Latitude of true scale',
  k0: 'Scale factor k₀',
  x0M: 'False easting',
  y0M: 'False northing',
};

/** What a definition resolved to: family, property, ellipsoid, parameters and the PROJ string. */
export function ResolvedDefinitionCard({ resolved }: { resolved: ResolvedDefinitionView }) {
  const { semiMajorAxisM, inverseFlattening } = resolved.ellipsoid;
  const params = Object.entries(resolved.params).filter(([, v]) => v !== undefined && v !== null);
  return (
    <div className="rounded-md border border-moss-700/40 bg-moss-50 px-4 py-3 text-sm">
      <p className="font-semibold text-moss-700">
        {resolved.label} — {resolved.family.title} ({resolved.family.property}, {resolved.family.class})
      </p>
      <dl className="mt-2 grid grid-cols-[max-content_1fr] gap-x-4 gap-y-0.5 text-ink-800">
        <dt>Ellipsoid</dt>
        <dd className="tabular">
          a = {semiMajorAxisM} m{inverseFlattening ? `, 1/f = ${inverseFlattening}` : ' (sphere)'}
        </dd>
        {params.map(([k, v]) => (
          <div key={k} className="contents">
            <dt>{PARAM_LABELS[k] ?? k}</dt>
            <dd className="tabular">{k.endsWith('Deg') ? `${v}°` : k.endsWith('M') ? `${v} m` : v}</dd>
          </div>
        ))}
      </dl>
      <code className="mt-2 block text-xs break-all text-ink-800">{resolved.resolved}</code>
    </div>
  );
}
