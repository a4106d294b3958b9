import { Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { RegionEntity } from '../districts/region.entity';
import { UserEntity } from './user.entity';

/** The regions a user is scoped to: their session holds every district of these regions (issue 17). */
@Entity({ name: 'user_regions' })
@Index('user_regions_region_idx', ['regionId'])
export class UserRegionEntity {
  @PrimaryColumn({ name: 'user_id', type: 'uuid' })
  userId: string;

  @PrimaryColumn({ name: 'region_id', type: 'uuid' })
  regionId: string;

  @ManyToOne(() => UserEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'user_regions_user_id_fkey' })
  user?: UserEntity;

  @ManyToOne(() => RegionEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'region_id', foreignKeyConstraintName: 'user_regions_region_id_fkey' })
  region?: RegionEntity;
}
