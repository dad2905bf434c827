import proj4 from 'proj4';

/** The fields of a proj4 projection object the engine reads (radians and metres). */
export interface Proj4Projection {
  names: string[];
  forward(p: { x: number; y: number }): { x: number; y: number } | null | undefined;
  inverse(p: { x: number; y: number }): { x: number; y: number } | null | undefined;
  a: number;
  es: number;
  lat0?: number;
  long0?: number;
  lat1?: number;
  lat2?: number;
  lat_ts?: number;
  k0?: number;
  x0?: number;
  y0?: number;
  zone?: number;
  utmSouth?: boolean;
  to_meter?: number;
  sphere?: boolean;
  [key: string]: unknown;
}

/**
 * Builds proj4's projection object for a definition (PROJ string or WKT) and returns its raw
 * forward/inverse, which take and return radians / metres without proj4's datum and axis steps.
 * Throws an Error naming the definition when proj4 cannot build it.
 */
export function createProj4Projection(definition: string): Proj4Projection {
  let projection: Proj4Projection;
  try {
    projection = (proj4 as unknown as { Proj: (d: string) => Proj4Projection }).Proj(definition);
  } catch (err) {
    const reason = err instanceof Error ? err.message : String(err);
    throw new Error(`cannot build the projection: ${reason}`);
  }
  if (!projection || typeof projection.forward !== 'function') {
    throw new Error('cannot build the projection: no forward transform');
  }
  return projection;
}
