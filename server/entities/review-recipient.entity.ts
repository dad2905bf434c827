import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/**
 * A reviewer a round was sent to. `userId` is empty until a reviewer without an account accepts
 * their invitation; the e-mail address is what ties the two together.
 */
@Entity('review_recipients')
@Index(['roundId', 'email'], { unique: true })
@Index(['studioId', 'email'])
export class ReviewRecipient {
  @PrimaryGeneratedColumn({ type: 'int' })
  id: number;

  @Column({ type: 'int' })
  roundId: number;

  @Column({ type: 'int' })
  projectId: number;

  @Column({ type: 'int' })
  studioId: number;

  @Column({ type: 'varchar', length: 254 })
  email: string;

  @Column({ type: 'int', nullable: true })
  userId: number | null;

  /** Whether this reviewer was sent an invitation (no account yet) or a plain request. */
  @Column({ type: 'boolean', default: false })
  invited: boolean;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;
}
