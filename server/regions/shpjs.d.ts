declare module 'shpjs' {
  /** Parses a zipped shapefile (honouring .prj) to a FeatureCollection, or one per layer. */
  function shp(input: ArrayBuffer | Uint8Array | Buffer): Promise<GeoJsonLike | GeoJsonLike[]>;
  interface GeoJsonLike {
    type: string;
    features: unknown[];
    fileName?: string;
  }
  export default shp;
}
