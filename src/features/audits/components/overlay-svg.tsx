import type { OverlayView, RouteView } from '@shared/api/audits.schema.js';

const path = (pts: [number, number][]) => pts.map(([x, y], i) => `${i ? 'L' : 'M'}${x} ${y}`).join('');

/**
 * The vector layer drawn over a heatmap in the same 1000 × 1000 frame: graticule, region outline,
 * Tissot ellipses, the worst samples and, when asked for, the two routes.
 */
export function OverlaySvg({ overlay, route, label }: { overlay: OverlayView; route?: RouteView; label: string }) {
  const v = overlay.viewBoxSize;
  return (
    <svg viewBox={`0 0 ${v} ${v}`} className="absolute inset-0 h-full w-full" role="img" aria-label={label}>
      <g fill="none" stroke="#5c566e" strokeOpacity="0.45" strokeWidth="1">
        {overlay.graticule.lines.flatMap((l) => l.parts.map((p, i) => <path key={`${l.kind}${l.valueDeg}-${i}`} d={path(p)} />))}
      </g>
      <g fill="none" stroke="#1b1726" strokeWidth="1.4">
        {overlay.outline.map((ring, i) => (
          <path key={i} d={`${path(ring)}Z`} />
        ))}
      </g>
      <g fill="#ffffff" fillOpacity="0.25" stroke="#1b1726" strokeWidth="1.2">
        {overlay.tissot.map((e, i) => (
          <ellipse key={i} cx={e.cx} cy={e.cy} rx={e.rx} ry={e.ry} transform={`rotate(${e.rotateDeg} ${e.cx} ${e.cy})`}>
            <title>{`${e.latDeg.toFixed(2)}°, ${e.lonDeg.toFixed(2)}°: a ${e.a.toFixed(4)}, b ${e.b.toFixed(4)}, s ${e.s.toFixed(4)}, ω ${e.omegaDeg.toFixed(2)}°`}</title>
          </ellipse>
        ))}
      </g>
      <g>
        {overlay.worst.map((w, i) => (
          <g key={i} transform={`translate(${w.x} ${w.y})`}>
            <path d="M-9 -9L9 9M9 -9L-9 9" stroke="#ffffff" strokeWidth="5" />
            <path d="M-9 -9L9 9M9 -9L-9 9" stroke="#b42318" strokeWidth="2.5" />
            <title>{`Worst ${w.kind.replace('-', ' ')}: ${w.text} at ${w.latDeg.toFixed(2)}°, ${w.lonDeg.toFixed(2)}°`}</title>
          </g>
        ))}
      </g>
      {route && (
        <g fill="none" strokeWidth="3">
          {route.lines.map((l) =>
            l.parts.map((p, i) => (
              <path key={`${l.kind}-${i}`} d={path(p)} stroke={l.kind === 'rhumb' ? '#e8b04a' : '#7a2553'} strokeDasharray={l.kind === 'rhumb' ? '10 6' : undefined} />
            )),
          )}
        </g>
      )}
    </svg>
  );
}
