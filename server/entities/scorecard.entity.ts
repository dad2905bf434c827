import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/** One candidate's metrics in one audit, with the sampled fields for heatmaps. */
@Entity('scorecards')
@Index(['auditId', 'candidateId'], { unique: true })
export class Scorecard {
  @PrimaryGeneratedColumn({ type: 'int' })
  id: number;

  @Column({ type: 'int' })
  auditId: number;

  @Column({ type: 'int' })
  candidateId: number;

  @Column({ type: 'int' })
  studioId: number;

  /** The engine's metrics object for this candidate. */
  @Column({ type: 'json' })
  metrics: unknown;

  /** Per-sample fields (packed Float32/Float64 arrays) for heatmaps and exports. */
  @Column({ type: 'longblob', nullable: true })
  fields: Buffer | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;
}
