import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

export type AuditStatus = 'queued' | 'running' | 'done' | 'failed';

/** One run of the engine over a region and a set of candidates, executed as a background job. */
@Entity('audits')
@Index(['projectId', 'createdAt'])
export class Audit {
  @PrimaryGeneratedColumn({ type: 'int' })
  id: number;

  @Column({ type: 'int' })
  projectId: number;

  @Column({ type: 'int' })
  studioId: number;

  @Column({ type: 'int' })
  regionId: number;

  /** Candidate ids audited, in order. */
  @Column({ type: 'json' })
  candidateIds: number[];

  @Column({ type: 'varchar', length: 20, default: 'queued' })
  status: AuditStatus;

  /** 0 … 1. */
  @Column({ type: 'double', default: 0 })
  progress: number;

  /** Sampling settings: { samples, seed, pairs, … }. */
  @Column({ type: 'json' })
  settings: unknown;

  @Column({ type: 'varchar', length: 40 })
  engineVersion: string;

  /** SHA-256 of the canonical JSON of every input (region hash, definitions, settings, engine version). */
  @Column({ type: 'char', length: 64 })
  inputHash: string;

  @Column({ type: 'json', nullable: true })
  timings: unknown;

  @Column({ type: 'text', nullable: true })
  error: string | null;

  @Column({ type: 'int' })
  createdById: number;

  @Column({ type: 'datetime', precision: 3, nullable: true })
  startedAt: Date | null;

  @Column({ type: 'datetime', precision: 3, nullable: true })
  finishedAt: Date | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;
}
