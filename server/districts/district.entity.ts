import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';
import type { PolygonGeometry } from '../../shared/api/districts.schema';

@Entity({ name: 'districts' })
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

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
