import { RAD_TO_DEG } from './constants';
import type { Ellipsoid } from './ellipsoid';
import type { EpsgEntry } from './epsg';
import { FAMILIES, familyFromNames, type FamilyInfo } from './families';
import { createProj4Projection, type Proj4Projection } from './proj4-object';
import { formatProjString, normaliseProjParams, parseProjString } from './proj-string';

export type DefinitionKind = 'proj' | 'epsg' | 'wkt';

/** The projection's defining parameters, degrees and metres. */
export interface ProjectionParams {
  lat0Deg: number;
  lon0Deg: number;
  lat1Deg?: number;
  lat2Deg?: number;
  latTsDeg?: number;
  k0: number;
  x0M: number;
  y0M: number;
}

/** A definition resolved to something the engine can evaluate: plain data, safe to post to a worker. */
export interface ResolvedDefinition {
  input: string;
  kind: DefinitionKind;
  label: string;
  /** The text handed to proj4 (a normalised PROJ string, or the WKT as given). */
  proj4: string;
  /** A PROJ string equivalent to the definition. */
  resolved: string;
  family: FamilyInfo;
  /** The ellipsoid of the definition. */
  ellipsoid: Ellipsoid;
  /** The surface the projection's formulae really use: a sphere of radius a for spherical-only families. */
  factorEllipsoid: Ellipsoid;
  params: ProjectionParams;
}

const round = (x: number) => Number(x.toPrecision(15));
const deg = (rad: number | undefined) => (rad === undefined || Number.isNaN(rad) ? undefined : round(rad * RAD_TO_DEG));

function classify(text: string): DefinitionKind {
  if (/^epsg:\s*\d+$/i.test(text)) return 'epsg';
  if (/^\+?proj=/.test(text) || text.startsWith('+')) return 'proj';
  if (/^[A-Z_]+\s*\[/i.test(text)) return 'wkt';
  throw new Error(`unrecognised definition "${text.slice(0, 60)}": expected a PROJ string (+proj=…), EPSG:n or WKT`);
}

function supportedList(): string {
  return Object.keys(FAMILIES).join(', ');
}

function paramsOf(p: Proj4Projection): ProjectionParams {
  return {
    lat0Deg: deg(p.lat0) ?? 0,
    lon0Deg: deg(p.long0) ?? 0,
    lat1Deg: deg(p.lat1),
    lat2Deg: deg(p.lat2),
    latTsDeg: deg(p.lat_ts),
    k0: typeof p.k0 === 'number' ? p.k0 : 1,
    x0M: typeof p.x0 === 'number' ? p.x0 : 0,
    y0M: typeof p.y0 === 'number' ? p.y0 : 0,
  };
}

/** A PROJ string built from the projection object's own fields (used for WKT input). */
function canonicalProjString(family: FamilyInfo, p: Proj4Projection, params: ProjectionParams): string {
  const parts = [`+proj=${family.id}`];
  if (family.id === 'utm') {
    parts.push(`+zone=${p.zone}`);
    if (p.utmSouth) parts.push('+south');
  } else {
    parts.push(`+lat_0=${params.lat0Deg}`, `+lon_0=${params.lon0Deg}`);
    if (family.class === 'conic' && params.lat1Deg !== undefined) parts.push(`+lat_1=${params.lat1Deg}`);
    if (family.class === 'conic' && params.lat2Deg !== undefined) parts.push(`+lat_2=${params.lat2Deg}`);
    if (params.latTsDeg !== undefined) parts.push(`+lat_ts=${params.latTsDeg}`);
    if (params.k0 !== 1 && params.latTsDeg === undefined) parts.push(`+k_0=${round(params.k0)}`);
  }
  parts.push(`+x_0=${params.x0M}`, `+y_0=${params.y0M}`);
  if (p.es === 0) parts.push(`+R=${p.a}`);
  else parts.push(`+a=${p.a}`, `+rf=${round(1 / (1 - Math.sqrt(1 - p.es)))}`);
  parts.push('+units=m');
  return parts.join(' ');
}

/** Finds an EPSG entry by code (the bundled index: see epsg.ts). */
export type EpsgLookup = (code: number) => EpsgEntry | undefined;

/**
 * resolveDefinition with the EPSG index passed in, so that callers which never see EPSG codes
 * (workers, the factors command with a PROJ string) need not load the 8 MB index.
 * Example: resolveDefinitionWith('+proj=merc').family.id === 'merc'.
 */
export function resolveDefinitionWith(definition: string, lookupEpsg?: EpsgLookup): ResolvedDefinition {
  const input = String(definition ?? '').trim();
  if (!input) throw new Error('empty definition: expected a PROJ string (+proj=…), EPSG:n or WKT');
  const kind = classify(input);
  let proj4Text: string;
  let resolved: string | undefined;
  let label: string | undefined;
  if (kind === 'epsg') {
    const code = Number(input.replace(/^epsg:\s*/i, ''));
    if (!lookupEpsg) throw new Error(`EPSG:${code}: no EPSG index was given to look it up in`);
    const entry = lookupEpsg(code);
    if (!entry) throw new Error(`unknown EPSG code ${code}`);
    if (!entry.kind.includes('PROJCRS')) {
      throw new Error(`EPSG:${code} (${entry.name}) is not a projected CRS (${entry.kind})`);
    }
    if (!entry.proj4) throw new Error(`EPSG:${code} (${entry.name}) has no PROJ form in the bundled index`);
    proj4Text = formatProjString(normaliseProjParams(parseProjString(entry.proj4)));
    resolved = proj4Text;
    label = `EPSG:${code} ${entry.name}`;
  } else if (kind === 'proj') {
    const params = parseProjString(input.startsWith('+') ? input : `+${input}`);
    const name = params.get('proj');
    if (typeof name !== 'string') throw new Error(`PROJ string without a +proj=… value: "${input}"`);
    if (name === 'longlat' || name === 'latlong' || name === 'lonlat' || name === 'latlon') {
      throw new Error(`+proj=${name} is geographic coordinates, not a map projection`);
    }
    if (!(name in FAMILIES) && name !== 'etmerc') {
      throw new Error(`projection +proj=${name} is not supported (supported: ${supportedList()})`);
    }
    proj4Text = formatProjString(normaliseProjParams(params));
    resolved = proj4Text;
  } else {
    proj4Text = input;
  }
  const projection = createProj4Projection(proj4Text);
  const family = familyFromNames(projection.names ?? []);
  if (!family) {
    throw new Error(`projection "${(projection.names ?? ['?'])[0]}" is not supported (supported: ${supportedList()})`);
  }
  const params = paramsOf(projection);
  if (!(projection.a > 0) || !(projection.es >= 0 && projection.es < 1)) {
    throw new Error(`invalid ellipsoid in the definition (a = ${projection.a}, e² = ${projection.es})`);
  }
  const ellipsoid: Ellipsoid = { aM: projection.a, es: projection.es };
  const factorEllipsoid: Ellipsoid = family.sphericalOnly ? { aM: projection.a, es: 0 } : ellipsoid;
  resolved ??= canonicalProjString(family, projection, params);
  label ??= kind === 'wkt' ? wktName(input) ?? family.title : family.title;
  return { input, kind, label, proj4: proj4Text, resolved, family, ellipsoid, factorEllipsoid, params };
}

function wktName(wkt: string): string | undefined {
  const m = /^[A-Z_]+\s*\[\s*"([^"]+)"/i.exec(wkt);
  return m?.[1];
}
