import { Column, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/**
 * The client's approval of one candidate, frozen. `recordJson` is the canonical JSON of every
 * input needed to reproduce the scorecard and `recordHash` its SHA-256. The database refuses
 * UPDATE and DELETE on this table (triggers in the ReviewSignOff migration); no route changes it.
 */
@Entity('sign_offs')
@Index(['roundId'], { unique: true })
@Index(['projectId'])
export class SignOff {
  @PrimaryGeneratedColumn({ type: 'int' })
  id: number;

  @Column({ type: 'int' })
  projectId: number;

  @Column({ type: 'int' })
  studioId: number;

  @Column({ type: 'int' })
  roundId: number;

  @Column({ type: 'int' })
  auditId: number;

  @Column({ type: 'int' })
  candidateId: number;

  @Column({ type: 'longtext' })
  recordJson: string;

  @Column({ type: 'char', length: 64 })
  recordHash: string;

  @Column({ type: 'int' })
  reviewerUserId: number;

  @Column({ type: 'varchar', length: 120 })
  reviewerName: string;

  @Column({ type: 'varchar', length: 254 })
  reviewerEmail: string;

  /** The name the reviewer typed as their signature. */
  @Column({ type: 'varchar', length: 120 })
  signature: string;

  @Column({ type: 'text', nullable: true })
  comment: string | null;

  /** Set by the service (not by a column default) because the same instant is inside the record. */
  @Column({ type: 'datetime', precision: 3 })
  approvedAt: Date;
}
