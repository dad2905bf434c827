import { geoAzimuthalEqualArea, geoCentroid, geoGraticule10, geoPath } from 'd3-geo';
import { useMemo } from 'react';
import type { RegionWithGeometry } from '@shared/api/regions.schema.js';

const SIZE = 360;

type Geometry = RegionWithGeometry['geometry'];

/**
 * d3-geo reads polygon rings as spherical with the interior on the right (clockwise), the
 * opposite of RFC 7946; the stored rings are reversed for drawing only.
 */
function forD3(g: Geometry): GeoJSON.Polygon | GeoJSON.MultiPolygon {
  const flip = (rings: number[][][]) => rings.map((r) => r.slice().reverse());
  return g.type === 'Polygon'
    ? { type: 'Polygon', coordinates: flip(g.coordinates as number[][][]) }
    : { type: 'MultiPolygon', coordinates: (g.coordinates as number[][][][]).map(flip) };
}

/**
 * The region on a Lambert azimuthal equal-area map centred on it (areas in proportion, shapes
 * fair near the centre), with a 10° graticule. A preview only: audits measure the candidates.
 */
export function RegionPreviewMap({ region }: { region: RegionWithGeometry }) {
  const drawing = useMemo(() => {
    const shape = forD3(region.geometry);
    const [cx, cy] = geoCentroid(shape);
    const projection = geoAzimuthalEqualArea().rotate([-cx, -cy]).fitExtent([[12, 12], [SIZE - 12, SIZE - 12]], shape);
    const path = geoPath(projection);
    return { region: path(shape) ?? '', graticule: path(geoGraticule10()) ?? '', sphere: path({ type: 'Sphere' }) ?? '' };
  }, [region.geometry]);
  return (
    <figure className="flex flex-col gap-2">
      <svg
        viewBox={`0 0 ${SIZE} ${SIZE}`}
        className="aspect-square w-full max-w-sm rounded-md border border-rule bg-paper"
        role="img"
        aria-label={`Map of ${region.name}`}
      >
        <defs>
          <clipPath id={`frame-${region.id}`}>
            <rect width={SIZE} height={SIZE} />
          </clipPath>
        </defs>
        <g clipPath={`url(#frame-${region.id})`}>
          <path d={drawing.sphere} fill="var(--color-surface)" stroke="var(--color-rule-strong)" />
          <path d={drawing.graticule} fill="none" stroke="var(--color-ink-500)" strokeOpacity=".35" strokeWidth="0.8" />
          <path d={drawing.region} fill="var(--color-mulberry-100)" stroke="var(--color-mulberry-700)" strokeWidth="1.2" fillRule="evenodd" />
        </g>
      </svg>
      <figcaption className="text-xs text-ink-600">
        {region.name}, on an equal-area map centred on it, graticule every 10°.
      </figcaption>
    </figure>
  );
}
