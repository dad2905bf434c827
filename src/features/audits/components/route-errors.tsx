import type { RouteView } from '@shared/api/audits.schema.js';

const km = (m: number) => `${(m / 1000).toLocaleString(undefined, { maximumFractionDigits: 1 })} km`;
const pct = (r: number) => `${r >= 0 ? '+' : ''}${(r * 100).toLocaleString(undefined, { maximumSignificantDigits: 3 })} %`;

/** Ground length, map length (after the best rescale) and their difference for both routes. */
export function RouteErrors({ route }: { route: RouteView }) {
  return (
    <table className="w-full text-xs">
      <caption className="sr-only">Route lengths on the ground and on this map</caption>
      <thead>
        <tr className="text-left text-ink-600">
          <th scope="col" className="py-1 font-medium">Route</th>
          <th scope="col" className="py-1 text-right font-medium">On the ground</th>
          <th scope="col" className="py-1 text-right font-medium">On the map</th>
          <th scope="col" className="py-1 text-right font-medium">Error</th>
        </tr>
      </thead>
      <tbody>
        {route.lines.map((l) => (
          <tr key={l.kind} className="border-t border-rule">
            <th scope="row" className="py-1 text-left font-medium">
              {l.kind === 'rhumb' ? 'Rhumb line (dashed)' : 'Great circle'}
              {!l.continuous && <span className="block font-normal text-ochre-800">crosses a break of the map</span>}
            </th>
            <td className="tabular py-1 text-right">{km(l.groundLengthM)}</td>
            <td className="tabular py-1 text-right">{km(l.scaledLengthM)}</td>
            <td className="tabular py-1 text-right">{pct(l.relativeError)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
