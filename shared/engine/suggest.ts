import type { RegionInput } from './region/geojson';
import type { PreparedRegion } from './region/prepare';
import { regionSummary, type RegionSummary } from './region/summary';

export type MapPurpose = 'equal-area' | 'conformal' | 'reference' | 'equidistant';
export const MAP_PURPOSES: readonly MapPurpose[] = ['equal-area', 'conformal', 'reference', 'equidistant'];

export interface Proposal {
  label: string;
  definition: string;
  family: string;
  reason: string;
}

const r2 = (x: number) => Math.round(x * 100) / 100;

/**
 * Proposes 6–12 candidates for a region and a map purpose, from its extent, shape and latitude.
 * Conic standard parallels follow the one-sixth rule (Deetz & Adams, USC&GS Special Publication
 * 68: one-sixth of the latitude range inside each limit), azimuthal families sit at the region's
 * centre, the transverse Mercator on its central meridian, polar regions get polar aspects, and
 * world extents get equal-area and compromise world maps. Rules of thumb are starting points,
 * not optima (Šavrič & Jenny 2016): see optimise().
 * Takes the region's summary, or the region itself (GeoJSON or prepared).
 * Example: suggestCandidates(regionSummary(usa48), 'equal-area')[0].family === 'aea'.
 */
export function suggestCandidates(input: RegionSummary | RegionInput | PreparedRegion, purpose: MapPurpose): Proposal[] {
  const region = 'centreLatDeg' in input ? input : regionSummary(input);
  if (!MAP_PURPOSES.includes(purpose)) throw new Error(`unknown purpose "${purpose}" (one of ${MAP_PURPOSES.join(', ')})`);
  const [, south, , north] = region.bbox;
  const lat0 = r2(region.centreLatDeg);
  const lon0 = r2(region.centreLonDeg);
  const span = north - south;
  const phi1 = r2(south + span / 6);
  const phi2 = r2(north - span / 6);
  const world = region.lonSpanDeg > 270 && span > 100;
  const hemispheric = !world && (region.lonSpanDeg > 140 || span > 90);
  const polar = region.containsPole !== null || Math.abs(region.centreLatDeg) > 70;
  const eastWest = region.eastWestSpreadKm > 1.3 * region.northSouthSpreadKm;
  const northSouth = region.northSouthSpreadKm > 1.3 * region.eastWestSpreadKm;
  const tropical = Math.abs(region.centreLatDeg) < 20 && Math.max(Math.abs(south), Math.abs(north)) < 30;
  const poleLat = region.containsPole === 'south' || (region.containsPole === null && region.centreLatDeg < 0) ? -90 : 90;
  const e = '+ellps=WGS84';
  const list: (Proposal & { fits: MapPurpose[] })[] = [];
  const add = (family: string, label: string, definition: string, reason: string, fits: MapPurpose[]) =>
    list.push({ family, label, definition: `${definition} ${family === 'robin' || family === 'moll' ? '+R=6371008.8' : e}`, reason, fits });

  if (world) {
    add('eqearth', 'Equal Earth', `+proj=eqearth +lon_0=${lon0}`, 'a world map that keeps areas true with a pleasing overall shape', ['equal-area', 'reference']);
    add('moll', 'Mollweide', `+proj=moll +lon_0=${lon0}`, 'a world map that keeps areas true, with an elliptical outline', ['equal-area']);
    add('robin', 'Robinson', `+proj=robin +lon_0=${lon0}`, 'a compromise world map: neither areas nor angles exact, both moderate', ['reference']);
    add('eqc', 'Equirectangular', `+proj=eqc +lon_0=${lon0}`, 'the simplest world grid: distances true along every meridian', ['equidistant', 'reference']);
    add('mill', 'Miller cylindrical', `+proj=mill +lon_0=${lon0}`, 'a compromise cylinder that tames the polar stretch of Mercator', ['reference']);
    add('merc', 'Mercator', `+proj=merc +lon_0=${lon0}`, 'keeps angles and compass bearings (rhumb lines straight) but hugely enlarges high latitudes', ['conformal']);
    add('sinu', 'Sinusoidal', `+proj=sinu +lon_0=${lon0}`, 'an equal-area world map with true scale along every parallel', ['equal-area', 'equidistant']);
    add('cea', 'Cylindrical equal-area (standard parallels ±45°)', `+proj=cea +lon_0=${lon0} +lat_ts=45`, 'an equal-area cylinder with true scale at ±45°', ['equal-area']);
    add('eck6', 'Eckert VI', `+proj=eck6 +lon_0=${lon0}`, 'an equal-area world map with flat poles', ['equal-area']);
    add('aeqd', `Azimuthal equidistant at ${lat0}°, ${lon0}°`, `+proj=aeqd +lat_0=${lat0} +lon_0=${lon0}`, 'distances and directions from the region\'s centre are true', ['equidistant']);
  } else if (polar) {
    const ts = r2(poleLat > 0 ? Math.max(60, south + span / 3) : Math.min(-60, north - span / 3));
    add('stere', `Polar stereographic (true scale at ${ts}°)`, `+proj=stere +lat_0=${poleLat} +lat_ts=${ts} +lon_0=${lon0}`, 'the usual conformal polar map, with true scale inside the region', ['conformal', 'reference']);
    add('laea', 'Polar Lambert azimuthal equal-area', `+proj=laea +lat_0=${poleLat} +lon_0=${lon0}`, 'keeps areas true around the pole, shapes bend only slowly outwards', ['equal-area', 'reference']);
    add('aeqd', 'Polar azimuthal equidistant', `+proj=aeqd +lat_0=${poleLat} +lon_0=${lon0}`, 'distances from the pole are true along every meridian', ['equidistant', 'reference']);
    add('stere', 'Polar stereographic (tangent at the pole)', `+proj=stere +lat_0=${poleLat} +lon_0=${lon0}`, 'conformal, true scale at the pole only', ['conformal']);
    add('laea', `Lambert azimuthal equal-area at the region's centre`, `+proj=laea +lat_0=${lat0} +lon_0=${lon0}`, 'equal-area, centred on the region rather than the pole', ['equal-area']);
    add('ortho', 'Orthographic (globe view)', `+proj=ortho +lat_0=${lat0} +lon_0=${lon0} +R=6371008.8`, 'a view of the globe from space, for context rather than measurement', ['reference']);
    add('lcc', `Lambert conformal conic (${phi1}°, ${phi2}°)`, `+proj=lcc +lat_1=${phi1} +lat_2=${phi2} +lat_0=${lat0} +lon_0=${lon0}`, 'conformal cone, standard parallels by the one-sixth rule', ['conformal']);
  } else {
    if (!tropical) {
      add('aea', `Albers equal-area conic (${phi1}°, ${phi2}°)`, `+proj=aea +lat_1=${phi1} +lat_2=${phi2} +lat_0=${lat0} +lon_0=${lon0}`, `keeps areas true; a cone suits a region spread east–west at mid-latitudes; standard parallels by the one-sixth rule`, ['equal-area', 'reference']);
      add('lcc', `Lambert conformal conic (${phi1}°, ${phi2}°)`, `+proj=lcc +lat_1=${phi1} +lat_2=${phi2} +lat_0=${lat0} +lon_0=${lon0}`, 'keeps angles and local shapes; the usual choice for mid-latitude regions spread east–west', ['conformal', 'reference']);
      add('eqdc', `Equidistant conic (${phi1}°, ${phi2}°)`, `+proj=eqdc +lat_1=${phi1} +lat_2=${phi2} +lat_0=${lat0} +lon_0=${lon0}`, 'distances true along meridians, a compromise between the two conics above', ['equidistant', 'reference']);
    }
    add('laea', `Lambert azimuthal equal-area at ${lat0}°, ${lon0}°`, `+proj=laea +lat_0=${lat0} +lon_0=${lon0}`, 'keeps areas true and suits a compact region: distortion grows evenly with distance from the centre', ['equal-area', 'reference']);
    add('stere', `Stereographic at ${lat0}°, ${lon0}°`, `+proj=stere +lat_0=${lat0} +lon_0=${lon0}`, 'conformal and centred on the region: round regions keep their shapes best', ['conformal']);
    add('aeqd', `Azimuthal equidistant at ${lat0}°, ${lon0}°`, `+proj=aeqd +lat_0=${lat0} +lon_0=${lon0}`, 'distances and directions from the region\'s centre are true', ['equidistant']);
    add('tmerc', `Transverse Mercator on ${lon0}°`, `+proj=tmerc +lon_0=${lon0} +k_0=0.9996`, northSouth ? 'conformal, and best for a region long from north to south' : 'conformal along the central meridian, shapes kept for narrow regions', ['conformal', 'reference']);
    if (tropical || eastWest) {
      add('merc', `Mercator (true scale at ${r2(lat0)}°)`, `+proj=merc +lon_0=${lon0} +lat_ts=${r2(Math.abs(lat0))}`, tropical ? 'conformal, with little size distortion this close to the equator' : 'conformal cylinder; straight rhumb lines for navigation charts', ['conformal']);
      add('cea', `Cylindrical equal-area (standard parallel ${r2(Math.abs(lat0))}°)`, `+proj=cea +lon_0=${lon0} +lat_ts=${r2(Math.abs(lat0))}`, 'equal-area cylinder fitted to the region\'s latitude', ['equal-area']);
      add('eqc', `Equirectangular (standard parallel ${r2(Math.abs(lat0))}°)`, `+proj=eqc +lon_0=${lon0} +lat_ts=${r2(Math.abs(lat0))}`, 'simple grid with true distances along meridians', ['equidistant', 'reference']);
    }
    add('sinu', `Sinusoidal on ${lon0}°`, `+proj=sinu +lon_0=${lon0}`, 'equal-area with true scale on every parallel; good near its central meridian', ['equal-area']);
    if (hemispheric || northSouth) add('moll', `Mollweide on ${lon0}°`, `+proj=moll +lon_0=${lon0}`, 'equal-area for very large regions', ['equal-area']);
    add('poly', `American polyconic on ${lon0}°`, `+proj=poly +lon_0=${lon0} +lat_0=${lat0}`, 'a classic compromise for regions along a central meridian: true scale on every parallel', ['reference']);
  }
  // Those fitting the purpose first, then the rest, 6 to 12 in all.
  const ranked = [...list.filter((c) => c.fits.includes(purpose)), ...list.filter((c) => !c.fits.includes(purpose))];
  return ranked.slice(0, 12).map(({ fits: _fits, ...p }) => p);
}
