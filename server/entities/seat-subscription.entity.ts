import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn, type Relation } from 'typeorm';
import { Studio } from './studio.entity.js';

export type SeatSubscriptionStatus = 'none' | 'incomplete' | 'active' | 'past_due' | 'canceled';

/**
 * A studio's staff-seat subscription at the payment provider, as Warpmeter last learned it
 * (from its own calls and from signed webhooks). `none`: a customer exists, no subscription yet.
 */
@Entity('seat_subscriptions')
export class SeatSubscription {
  @PrimaryGeneratedColumn({ type: 'int' })
  id: number;

  @Index({ unique: true })
  @Column({ type: 'int' })
  studioId: number;

  @ManyToOne(() => Studio, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'studioId' })
  studio: Relation<Studio>;

  @Index({ unique: true })
  @Column({ type: 'varchar', length: 255 })
  customerId: string;

  @Index({ unique: true })
  @Column({ type: 'varchar', length: 255, nullable: true })
  subscriptionId: string | null;

  @Column({ type: 'varchar', length: 255, nullable: true })
  subscriptionItemId: string | null;

  @Column({ type: 'int', default: 0 })
  quantity: number;

  @Column({ type: 'varchar', length: 20, default: 'none' })
  status: SeatSubscriptionStatus;

  @Column({ type: 'datetime', precision: 3, nullable: true })
  currentPeriodEnd: Date | null;

  /** Set when a payment fails; new staff are refused after it, existing work stays open. */
  @Column({ type: 'datetime', precision: 3, nullable: true })
  graceUntil: Date | null;

  @Column({ type: 'varchar', length: 30, nullable: true })
  cardBrand: string | null;

  @Column({ type: 'char', length: 4, nullable: true })
  cardLast4: string | null;

  /** `created` (provider seconds) of the newest event applied; older events are stored, not applied. */
  @Column({ type: 'bigint', default: 0, transformer: { to: (v: number) => v, from: (v: string | number) => Number(v) } })
  lastEventCreated: number;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', onUpdate: 'CURRENT_TIMESTAMP(3)' })
  updatedAt: Date;
}
