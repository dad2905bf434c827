// shpjs ships no type declarations; these cover the two parsers we call.
declare module 'shpjs' {
  import type { Geometry } from 'geojson';
  /** Parses a .shp; with a .prj text, reprojects every coordinate to WGS84 lon/lat through proj4. */
  export function parseShp(shp: ArrayBufferView | ArrayBuffer, prj?: string | false): (Geometry | null)[];
  /** Parses a .dbf, decoding text with the .cpg code page (UTF-8 when absent or unknown). */
  export function parseDbf(dbf: ArrayBufferView | ArrayBuffer, cpg?: string): Record<string, unknown>[];
  /** Parses a whole zipped shapefile (honouring .prj) to a FeatureCollection, or one per layer. */
  export default function shp(input: ArrayBuffer | ArrayBufferView): Promise<ShpCollection | ShpCollection[]>;
  export interface ShpCollection {
    type: string;
    features: unknown[];
    fileName?: string;
  }
}
