import geographiclib from 'geographiclib-geodesic';
import type { OverlayView, RouteLineView, RouteView } from '../../shared/api/audits.schema.js';
import { badRequest } from '../http/errors.js';
import { frameFor, projectRings, ringsOf, ringsToPixels, toUnit, type Frame } from '../heatmaps/frame.js';
import { graticuleFor } from '../heatmaps/graticule.js';
import { rasterMask } from '../heatmaps/raster-mask.js';
import { geodesicPoints } from '../../shared/engine/routes.js';
import { checkRouteEnds, rhumbPoints } from '../heatmaps/route-lines.js';
import { majorAxisAngleRad } from '../heatmaps/tissot-ellipse.js';
import type { CandidateContext } from './heatmaps.service.js';

const VIEW = 1000;
/** Tissot ellipses per side of the frame's lattice: the first of these that puts MIN_ELLIPSES inside the region. */
const LATTICES = [7, 9, 12, 16, 20, 24];
const MIN_ELLIPSES = 20;
/** The median ellipse's semi-major axis as a share of the lattice spacing. */
const ELLIPSE_FILL = 0.38;
const WORST_PER_KIND = 3;
const geod = geographiclib.Geodesic.WGS84;
/** Segments each route is drawn with. */
const ROUTE_STEPS = 128;

/** Consecutive longitudes within 180° of each other, so a route across ±180° stays one line. */
function unwrap(points: [number, number][]): [number, number][] {
  for (let i = 1; i < points.length; i++) {
    let lon = points[i][0];
    while (lon - points[i - 1][0] > 180) lon -= 360;
    while (lon - points[i - 1][0] < -180) lon += 360;
    points[i][0] = lon;
  }
  return points;
}

const r2 = (v: number) => Math.round(v * 100) / 100;
const toView = (frame: Frame, x: number, y: number): [number, number] => {
  const [u, v] = toUnit(frame, x, y);
  return [r2(u * VIEW), r2(v * VIEW)];
};

/** Projects a lon/lat polyline into view units, split where the projection is undefined or jumps across the frame. */
function projectPolyline(ctx: CandidateContext, frame: Frame, points: [number, number][]): [number, number][][] {
  const parts: [number, number][][] = [];
  let cur: [number, number][] = [];
  for (const [lon, lat] of points) {
    const p = ctx.projection.forwardDeg(lon, lat);
    const q = p && toView(frame, p[0], p[1]);
    const prev = cur[cur.length - 1];
    if (!q || (prev && Math.hypot(q[0] - prev[0], q[1] - prev[1]) > VIEW / 2)) {
      if (cur.length > 1) parts.push(cur);
      cur = q ? [q] : [];
      continue;
    }
    if (!prev || Math.abs(q[0] - prev[0]) + Math.abs(q[1] - prev[1]) >= 0.5) cur.push(q);
  }
  if (cur.length > 1) parts.push(cur);
  return parts;
}

function regionFrame(ctx: CandidateContext) {
  const rings = projectRings(ringsOf(ctx.geometry), ctx.projection.forwardDeg);
  return { rings, frame: frameFor(rings) };
}

/** Outline, graticule, a lattice of Tissot indicatrices and the worst samples, in the heatmap's frame. */
export function overlay(ctx: CandidateContext): OverlayView {
  const { rings, frame } = regionFrame(ctx);
  const outline = rings.map((r) => {
    const pts: [number, number][] = [];
    for (let i = 0; i < r.length; i += 2) {
      const q = toView(frame, r[i], r[i + 1]);
      const prev = pts[pts.length - 1];
      if (!prev || Math.abs(q[0] - prev[0]) + Math.abs(q[1] - prev[1]) >= 0.5) pts.push(q);
    }
    return pts;
  });
  const grat = graticuleFor(ctx.bbox);
  const graticule = {
    intervalDeg: grat.intervalDeg,
    lines: grat.lines.map((l) => ({ kind: l.kind, valueDeg: l.valueDeg, parts: projectPolyline(ctx, frame, l.points) })).filter((l) => l.parts.length),
  };

  // Lattice points whose pixel lies inside the region's mask (the same test the heatmap uses).
  const MASK = 512;
  const mask = rasterMask(ringsToPixels(rings, frame, MASK), MASK, MASK);
  const ll = new Float64Array(2);
  const f = new Float64Array(8);
  const lattice = LATTICES.find((n) => latticeInside(mask, MASK, n) >= MIN_ELLIPSES) ?? LATTICES[LATTICES.length - 1];
  const raw: Omit<OverlayView['tissot'][number], 'rx' | 'ry'>[] = [];
  for (let j = 0; j < lattice; j++) {
    for (let i = 0; i < lattice; i++) {
      const u = (i + 0.5) / lattice, v = (j + 0.5) / lattice;
      if (!mask[Math.floor(v * MASK) * MASK + Math.floor(u * MASK)]) continue;
      const x = frame.cx + (u - 0.5) * frame.span, y = frame.cy + (0.5 - v) * frame.span;
      if (!ctx.projection.inverse(x, y, ll) || !ctx.projection.factors(ll[0], ll[1], f)) continue;
      const lonDeg = (ll[0] * 180) / Math.PI, latDeg = (ll[1] * 180) / Math.PI;
      const theta = majorAxisAngleRad(ctx.resolved, ctx.projection, lonDeg, latDeg);
      if (theta === null) continue;
      raw.push({ lonDeg, latDeg, cx: r2(u * VIEW), cy: r2(v * VIEW), rotateDeg: r2((-theta * 180) / Math.PI), a: f[4], b: f[5], s: f[2], omegaDeg: f[3] });
    }
  }
  const sortedA = raw.map((e) => e.a).sort((p, q) => p - q);
  const medianA = sortedA[Math.floor(sortedA.length / 2)] ?? 1;
  const unit = (ELLIPSE_FILL * VIEW) / lattice / medianA;
  const tissot = raw.map((e) => ({ ...e, rx: r2(e.a * unit), ry: r2(e.b * unit) }));

  return { candidateId: ctx.candidate.id, frame, viewBoxSize: VIEW, outline, graticule, tissot, worst: worstSamples(ctx, frame) };
}

/** How many points of an n × n lattice over the frame fall inside the region's mask. */
function latticeInside(mask: Uint8Array, maskSize: number, n: number): number {
  let count = 0;
  for (let j = 0; j < n; j++) for (let i = 0; i < n; i++) count += mask[Math.floor(((j + 0.5) / n) * maskSize) * maskSize + Math.floor(((i + 0.5) / n) * maskSize)];
  return count;
}

/** The samples with the largest |ln s|, ω and scale error, WORST_PER_KIND of each. */
function worstSamples(ctx: CandidateContext, frame: Frame): OverlayView['worst'] {
  const { fields, stats } = ctx;
  const lnC = Math.log(stats.bestScale);
  const kinds = [
    { kind: 'areal-scale' as const, score: (i: number) => Math.abs(Math.log(fields.s[i])), text: (i: number) => `s = ${fields.s[i].toPrecision(4)}`, value: (i: number) => fields.s[i] },
    { kind: 'angular-deformation' as const, score: (i: number) => fields.omegaDeg[i], text: (i: number) => `ω = ${fields.omegaDeg[i].toPrecision(3)}°`, value: (i: number) => fields.omegaDeg[i] },
    {
      kind: 'scale-error' as const,
      score: (i: number) => Math.max(Math.abs(lnC + Math.log(fields.a[i])), Math.abs(lnC + Math.log(fields.b[i]))),
      value: (i: number) => (Math.exp(Math.max(Math.abs(lnC + Math.log(fields.a[i])), Math.abs(lnC + Math.log(fields.b[i])))) - 1) * 100,
      text: (i: number) => `scale error ${((Math.exp(Math.max(Math.abs(lnC + Math.log(fields.a[i])), Math.abs(lnC + Math.log(fields.b[i])))) - 1) * 100).toPrecision(3)} %`,
    },
  ];
  const out: OverlayView['worst'] = [];
  for (const k of kinds) {
    const top: number[] = [];
    for (let i = 0; i < fields.s.length; i++) {
      const sc = k.score(i);
      if (!Number.isFinite(sc)) continue;
      if (top.length < WORST_PER_KIND || sc > k.score(top[top.length - 1])) {
        top.push(i);
        top.sort((p, q) => k.score(q) - k.score(p));
        if (top.length > WORST_PER_KIND) top.pop();
      }
    }
    for (const i of top) {
      const p = ctx.projection.forwardDeg(fields.lonDeg[i], fields.latDeg[i]);
      if (!p) continue;
      const [x, y] = toView(frame, p[0], p[1]);
      out.push({ kind: k.kind, lonDeg: fields.lonDeg[i], latDeg: fields.latDeg[i], x, y, value: k.value(i), text: k.text(i) });
    }
  }
  return out;
}

/** Length of a lon/lat polyline on WGS84, summing GeographicLib geodesics between its points. */
function groundLengthM(points: [number, number][]): number {
  let sum = 0;
  for (let i = 1; i < points.length; i++) sum += geod.Inverse(points[i - 1][1], points[i - 1][0], points[i][1], points[i][0]).s12 ?? 0;
  return sum;
}

function drawLine(ctx: CandidateContext, frame: Frame, kind: 'great-circle' | 'rhumb', lonLat: [number, number][], groundM: number): RouteLineView {
  const pointsM: [number, number][] = [];
  const pieces: [number, number][][] = [[]];
  for (const [lon, lat] of lonLat) {
    const p = ctx.projection.forwardDeg(lon, lat);
    if (!p) {
      if (pieces[pieces.length - 1].length) pieces.push([]);
      continue;
    }
    pointsM.push(p);
    const last = pieces[pieces.length - 1];
    const prev = last[last.length - 1];
    if (prev && Math.hypot(p[0] - prev[0], p[1] - prev[1]) > frame.span / 2) pieces.push([p]);
    else last.push(p);
  }
  const drawn = pieces.filter((p) => p.length > 1);
  let projectedM = 0;
  for (const piece of drawn) for (let i = 1; i < piece.length; i++) projectedM += Math.hypot(piece[i][0] - piece[i - 1][0], piece[i][1] - piece[i - 1][1]);
  const scaledM = projectedM * ctx.stats.bestScale;
  return {
    kind,
    groundLengthM: groundM,
    projectedLengthM: projectedM,
    scaledLengthM: scaledM,
    relativeError: scaledM / groundM - 1,
    continuous: drawn.length === 1 && pointsM.length === lonLat.length,
    pointsLonLat: lonLat,
    pointsM,
    parts: drawn.map((piece) => piece.map(([x, y]) => toView(frame, x, y))),
  };
}

/**
 * The great circle and the rhumb line between two places, drawn on the candidate, each with its
 * ground length (WGS84, GeographicLib), its length on the map after the candidate's best uniform
 * scale, and the relative difference.
 */
export function routeBetween(ctx: CandidateContext, from: [number, number], to: [number, number]): RouteView {
  const { frame } = regionFrame(ctx);
  let gc: [number, number][], rh: [number, number][];
  const geodesicM = geod.Inverse(from[1], from[0], to[1], to[0]).s12 ?? NaN;
  try {
    checkRouteEnds(from, to);
    // The shortest path on the surface the candidate itself uses (a great circle on a sphere),
    // so a gnomonic candidate draws it straight; its ground length is the WGS84 geodesic.
    gc = unwrap(geodesicPoints(from, to, geodesicM / 1000 / ROUTE_STEPS, ctx.resolved.factorEllipsoid));
    rh = rhumbPoints(from, to, ctx.resolved.ellipsoid.es, ROUTE_STEPS);
  } catch (err) {
    throw badRequest(`No route can be drawn: ${(err as Error).message}.`);
  }
  return {
    candidateId: ctx.candidate.id,
    from,
    to,
    bestScale: ctx.stats.bestScale,
    lines: [drawLine(ctx, frame, 'great-circle', gc, geodesicM), drawLine(ctx, frame, 'rhumb', rh, groundLengthM(rh))],
  };
}
