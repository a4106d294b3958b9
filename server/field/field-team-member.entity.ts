import { Entity, Index, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { UserEntity } from '../users/user.entity';
import { FieldTeamEntity } from './field-team.entity';

/** A person on a field team (an officer or a community worker). */
@Entity({ name: 'field_team_members' })
@Index('field_team_members_user_idx', ['userId'])
export class FieldTeamMemberEntity {
  @PrimaryColumn({ name: 'team_id', type: 'uuid' })
  teamId: string;

  @PrimaryColumn({ name: 'user_id', type: 'uuid' })
  userId: string;

  @ManyToOne(() => FieldTeamEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'team_id', foreignKeyConstraintName: 'field_team_members_team_id_fkey' })
  team?: FieldTeamEntity;

  @ManyToOne(() => UserEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'user_id', foreignKeyConstraintName: 'field_team_members_user_id_fkey' })
  user?: UserEntity;
}
