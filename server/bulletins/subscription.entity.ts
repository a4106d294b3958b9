import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { MailKind } from '../../shared/api/bulletins.schema';
import { DistrictEntity } from '../districts/district.entity';
import { UserEntity } from '../users/user.entity';

/**
 * Who receives what for one district. A user with no rows at all gets their role's default
 * (docs/flags-and-bulletins.md); once they save their preferences (or unsubscribe) their rows decide.
 */
@Entity({ name: 'subscriptions' })
@Index('subscriptions_user_district_key', ['userId', 'districtId'], { unique: true })
@Index('subscriptions_district_idx', ['districtId'])
@Check('subscriptions_kinds_check', "kinds <@ ARRAY['advisory', 'bulletin']::text[]")
export class SubscriptionEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ name: 'user_id', type: 'uuid' })
  userId: string;

  @ManyToOne(() => UserEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id' })
  user?: UserEntity;

  @Column({ name: 'district_id', type: 'uuid' })
  districtId: string;

  @ManyToOne(() => DistrictEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'district_id' })
  district?: DistrictEntity;

  @Column({ type: 'text', array: true })
  kinds: MailKind[];

  @Column({ type: 'boolean', default: true })
  active: boolean;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
