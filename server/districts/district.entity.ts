import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { RegionEntity } from './region.entity';
import type { PolygonGeometry } from '../../shared/api/districts.schema';

@Entity({ name: 'districts' })
@Index('districts_region_idx', ['regionId'])
export class DistrictEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index('districts_code_key', { unique: true })
  @Column({ type: 'text' })
  code: string;

  @Column({ type: 'text' })
  name: string;

  /** Rows of the invented demo region carry this mark so every screen can label them. */
  @Column({ name: 'is_demo', type: 'boolean', default: false })
  isDemo: boolean;

  /** GeoJSON Polygon or MultiPolygon (RFC 7946, WGS 84 longitude/latitude). */
  @Column({ type: 'jsonb', nullable: true })
  boundary: PolygonGeometry | null;

  @Column({ name: 'centroid_lat', type: 'double precision', nullable: true })
  centroidLat: number | null;

  @Column({ name: 'centroid_lon', type: 'double precision', nullable: true })
  centroidLon: number | null;

  /** The boundary simplified for display (topology-preserving, at import); the map draws it, station
   * assignment keeps using the full `boundary`. Null: the map falls back to the full boundary. */
  @Column({ name: 'display_boundary', type: 'jsonb', nullable: true })
  displayBoundary?: PolygonGeometry | null;

  /** The region the district belongs to (one level above it), if any. */
  @Column({ name: 'region_id', type: 'uuid', nullable: true })
  regionId?: string | null;

  @ManyToOne(() => RegionEntity, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'region_id', foreignKeyConstraintName: 'districts_region_id_fkey' })
  region?: RegionEntity;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
