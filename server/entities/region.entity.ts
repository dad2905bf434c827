import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/**
 * The mapped region's boundary as stored after upload: WGS84 lon/lat GeoJSON (RFC 7946 winding),
 * its SHA-256 (of the canonical JSON of the geometry) and what validation found.
 */
@Entity('regions')
@Index(['projectId', 'createdAt'])
export class Region {
  @PrimaryGeneratedColumn({ type: 'int' })
  id: number;

  @Column({ type: 'int' })
  projectId: number;

  @Column({ type: 'int' })
  studioId: number;

  @Column({ type: 'varchar', length: 200 })
  name: string;

  @Column({ type: 'varchar', length: 255 })
  sourceFileName: string;

  @Column({ type: 'varchar', length: 20 })
  sourceFormat: 'geojson' | 'topojson' | 'shapefile';

  /** The CRS the file was in (WKT of the .prj, or "EPSG:4326" for GeoJSON). */
  @Column({ type: 'text' })
  sourceCrs: string;

  /** A GeoJSON Polygon or MultiPolygon geometry. */
  @Column({ type: 'json' })
  geometry: unknown;

  @Column({ type: 'char', length: 64 })
  sha256: string;

  @Column({ type: 'double' })
  areaKm2: number;

  /** [west, south, east, north] in degrees. */
  @Column({ type: 'json' })
  bbox: number[];

  @Column({ type: 'int' })
  vertexCount: number;

  @Column({ type: 'int' })
  partCount: number;

  @Column({ type: 'int' })
  holeCount: number;

  /** The validation report shown after upload (warnings, fixes made, feature names picked). */
  @Column({ type: 'json' })
  report: unknown;

  /** The region audits use now; earlier uploads are kept for history. */
  @Column({ type: 'boolean', default: true })
  isCurrent: boolean;

  @Column({ type: 'int' })
  createdById: number;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;
}
