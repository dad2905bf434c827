import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

export type ReviewRoundStatus = 'open' | 'approved' | 'returned';

/**
 * One shortlist sent to the client for a decision. Rounds are never deleted: a returned round
 * stays as history and the next shortlist becomes round n + 1.
 */
@Entity('review_rounds')
@Index(['projectId', 'roundNumber'], { unique: true })
export class ReviewRound {
  @PrimaryGeneratedColumn({ type: 'int' })
  id: number;

  @Column({ type: 'int' })
  projectId: number;

  @Column({ type: 'int' })
  studioId: number;

  @Column({ type: 'int' })
  auditId: number;

  /** 1, 2, … within the project. */
  @Column({ type: 'int' })
  roundNumber: number;

  /** Shortlisted candidate ids (1–4), in the editor's order. */
  @Column({ type: 'json' })
  candidateIds: number[];

  /**
   * The shortlisted scorecards as sent (label, definitions, metrics), so the round reads the same
   * later even if a candidate is edited or removed from the project afterwards.
   */
  @Column({ type: 'json' })
  shortlist: unknown;

  /** Plain text with paragraphs and "- " lists; never rendered as HTML. */
  @Column({ type: 'text' })
  recommendation: string;

  @Column({ type: 'int' })
  requestedById: number;

  @Column({ type: 'varchar', length: 20, default: 'open' })
  status: ReviewRoundStatus;

  @Column({ type: 'int', nullable: true })
  decidedById: number | null;

  @Column({ type: 'datetime', precision: 3, nullable: true })
  decidedAt: Date | null;

  @Column({ type: 'text', nullable: true })
  decisionComment: string | null;

  /** The approved candidate, when the round was approved. */
  @Column({ type: 'int', nullable: true })
  chosenCandidateId: number | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;
}
