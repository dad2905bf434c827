import { Column, Entity, Index, PrimaryGeneratedColumn, CreateDateColumn } from 'typeorm';

/** What Warpmeter did with a verified event. */
export type PaymentEventOutcome = 'applied' | 'stale' | 'unmatched' | 'ignored';

/**
 * Every verified webhook event from the payment provider, kept as received. The unique event id
 * makes delivery idempotent: the row is inserted in the same transaction as the event's effect,
 * so a replayed event finds its row and changes nothing.
 */
@Entity('payment_events')
@Index(['studioId', 'processedAt'])
export class PaymentEvent {
  @PrimaryGeneratedColumn({ type: 'int' })
  id: number;

  @Index({ unique: true })
  @Column({ type: 'varchar', length: 255 })
  eventId: string;

  @Column({ type: 'varchar', length: 100 })
  type: string;

  @Column({ type: 'int', nullable: true })
  studioId: number | null;

  /** The event's own `created` (seconds at the provider). */
  @Column({ type: 'bigint', transformer: { to: (v: number) => v, from: (v: string | number) => Number(v) } })
  eventCreated: number;

  @Column({ type: 'varchar', length: 20 })
  outcome: PaymentEventOutcome;

  @Column({ type: 'json' })
  payload: unknown;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  processedAt: Date;
}
