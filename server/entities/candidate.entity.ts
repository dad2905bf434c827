import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/** A projection considered for a project: as entered, as resolved, and where it came from. */
@Entity('candidates')
@Index(['projectId'])
export class Candidate {
  @PrimaryGeneratedColumn({ type: 'int' })
  id: number;

  @Column({ type: 'int' })
  projectId: number;

  @Column({ type: 'int' })
  studioId: number;

  @Column({ type: 'varchar', length: 160 })
  label: string;

  /** Exactly what the user entered or the engine proposed (PROJ string, EPSG:n or WKT). */
  @Column({ type: 'text' })
  definition: string;

  /** The proj4 definition the engine resolved it to. */
  @Column({ type: 'text' })
  resolved: string;

  @Column({ type: 'varchar', length: 40 })
  family: string;

  @Column({ type: 'varchar', length: 20 })
  origin: 'proposed' | 'optimised' | 'entered';

  @Column({ type: 'varchar', length: 500, nullable: true })
  reason: string | null;

  /** Optimiser output or proposal parameters, when there are any. */
  @Column({ type: 'json', nullable: true })
  params: unknown;

  @Column({ type: 'int' })
  createdById: number;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;
}
