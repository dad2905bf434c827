/**
 * The projection families the engine knows, keyed by PROJ's short name, with the facts the
 * factors, sampling and proposal code need about each.
 */

export type FamilyClass = 'cylindrical' | 'pseudocylindrical' | 'conic' | 'azimuthal' | 'transverse' | 'other';
export type FamilyProperty = 'conformal' | 'equal-area' | 'equidistant' | 'compromise' | 'perspective';

export interface FamilyInfo {
  /** PROJ short name, e.g. "lcc". */
  id: string;
  title: string;
  class: FamilyClass;
  property: FamilyProperty;
  /** Computed on a sphere of radius a even when an ellipsoid is given (as PROJ and proj4 both do). */
  sphericalOnly: boolean;
  /** The poles are singular (mapped to a line, or the indicatrix degenerates there). */
  poleSingular: boolean;
  /** Valid only within this angular distance (radians) of the centre (lat_0, lon_0), exclusive. */
  maxCentreDistanceRad?: number;
  /** Finite-difference step for this family when not DERIVATIVE_STEP_RAD (see the family's note). */
  stepRad?: number;
}

const f = (
  id: string,
  title: string,
  cls: FamilyClass,
  property: FamilyProperty,
  sphericalOnly: boolean,
  poleSingular: boolean,
  maxCentreDistanceRad?: number,
): FamilyInfo => ({ id, title, class: cls, property, sphericalOnly, poleSingular, maxCentreDistanceRad });

export const FAMILIES: Readonly<Record<string, FamilyInfo>> = Object.freeze({
  merc: f('merc', 'Mercator', 'cylindrical', 'conformal', false, true),
  tmerc: f('tmerc', 'Transverse Mercator', 'transverse', 'conformal', false, false),
  utm: f('utm', 'Universal Transverse Mercator', 'transverse', 'conformal', false, false),
  lcc: f('lcc', 'Lambert conformal conic', 'conic', 'conformal', false, true),
  aea: f('aea', 'Albers equal-area conic', 'conic', 'equal-area', false, true),
  eqdc: f('eqdc', 'Equidistant conic', 'conic', 'equidistant', false, true),
  laea: f('laea', 'Lambert azimuthal equal-area', 'azimuthal', 'equal-area', false, false),
  stere: f('stere', 'Stereographic', 'azimuthal', 'conformal', false, false),
  sterea: f('sterea', 'Oblique stereographic (double)', 'azimuthal', 'conformal', false, false),
  aeqd: f('aeqd', 'Azimuthal equidistant', 'azimuthal', 'equidistant', false, false),
  ortho: f('ortho', 'Orthographic', 'azimuthal', 'perspective', true, false, Math.PI / 2),
  gnom: f('gnom', 'Gnomonic', 'azimuthal', 'perspective', true, false, Math.PI / 2),
  cea: f('cea', 'Cylindrical equal-area', 'cylindrical', 'equal-area', false, true),
  eqc: f('eqc', 'Equirectangular', 'cylindrical', 'equidistant', true, true),
  mill: f('mill', 'Miller cylindrical', 'cylindrical', 'compromise', true, true),
  moll: f('moll', 'Mollweide', 'pseudocylindrical', 'equal-area', true, true),
  sinu: f('sinu', 'Sinusoidal', 'pseudocylindrical', 'equal-area', false, true),
  robin: f('robin', 'Robinson', 'pseudocylindrical', 'compromise', true, true),
  eqearth: f('eqearth', 'Equal Earth', 'pseudocylindrical', 'equal-area', false, true),
  eck6: f('eck6', 'Eckert VI', 'pseudocylindrical', 'equal-area', true, true),
  vandg: f('vandg', 'Van der Grinten', 'other', 'compromise', true, true),
  // The polyconic's forward formulae cancel near the equator (cot φ·(1 − cos E)), leaving rounding
  // noise ~1e-11 m/m in y: a 1e-4 rad step keeps the derivative's noise below 1e-9 there.
  poly: { ...f('poly', 'American polyconic', 'other', 'compromise', false, false), stepRad: 1e-4 },
  bonne: f('bonne', 'Bonne', 'other', 'equal-area', false, true),
  omerc: f('omerc', 'Oblique Mercator', 'transverse', 'conformal', false, false),
  somerc: f('somerc', 'Swiss oblique Mercator', 'transverse', 'conformal', false, false),
});

/** Short names proj4 uses internally for a family, mapped to the family id. */
const ALIASES: Readonly<Record<string, string>> = Object.freeze({ etmerc: 'tmerc' });

/** Looks up a family from the list of names proj4 attaches to a projection. */
export function familyFromNames(names: readonly string[]): FamilyInfo | undefined {
  for (const n of names) {
    const id = ALIASES[n] ?? n;
    if (id in FAMILIES) return FAMILIES[id];
  }
  return undefined;
}
