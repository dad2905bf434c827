declare module 'epsg-index/all.json' {
  const table: Record<string, unknown>;
  export default table;
}
