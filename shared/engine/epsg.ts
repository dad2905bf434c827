import epsgIndex from 'epsg-index/all.json';

/** One entry of the bundled EPSG index (the parts the engine reads). */
export interface EpsgEntry {
  code: string;
  kind: string;
  name: string;
  proj4: string | null;
  wkt: string | null;
  /** [north, west, south, east] in degrees, as the index stores it. */
  bbox?: number[];
}

const TABLE = epsgIndex as unknown as Readonly<Record<string, EpsgEntry>>;

/** Looks up an EPSG code in the index bundled with the engine (no network). Example: lookupEpsg(5070)?.name. */
export function lookupEpsg(code: number): EpsgEntry | undefined {
  return TABLE[String(code)];
}
