import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/** One line of a project's history: who did what, when. Written by the services that act. */
@Entity('activity_events')
@Index(['projectId', 'createdAt'])
export class ActivityEvent {
  @PrimaryGeneratedColumn({ type: 'int' })
  id: number;

  @Column({ type: 'int' })
  projectId: number;

  @Column({ type: 'int' })
  studioId: number;

  /** Empty for the system (a background job finishing). */
  @Column({ type: 'int', nullable: true })
  actorId: number | null;

  @Column({ type: 'varchar', length: 120 })
  actorName: string;

  @Column({ type: 'varchar', length: 20 })
  actorRole: string;

  /** Dotted kind, e.g. `region.uploaded`, `candidate.added`, `audit.started`, `round.approved`. */
  @Column({ type: 'varchar', length: 60 })
  kind: string;

  @Column({ type: 'varchar', length: 300 })
  summary: string;

  @Column({ type: 'json', nullable: true })
  details: Record<string, unknown> | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;
}
