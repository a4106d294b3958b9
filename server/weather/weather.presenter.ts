import type { StationDto, UploadDto } from '../../shared/api/weather.schema';
import { capText } from '../http/limits';
import type { WeatherUploadEntity } from './weather-upload.entity';

export interface StationRow {
  id: string; code: string; name: string; latitude: number; longitude: number; elevation: number | null;
  active_from: string | null; active_to: string | null; is_demo: boolean;
  district_id: string | null; district_code: string | null; district_name: string | null;
  last_date: string | null; days: number;
}

export const presentStation = (r: StationRow): StationDto => ({
  id: r.id,
  code: r.code,
  name: r.name,
  latitude: r.latitude,
  longitude: r.longitude,
  elevation: r.elevation,
  activeFrom: r.active_from,
  activeTo: r.active_to,
  isDemo: r.is_demo,
  district: r.district_id ? { id: r.district_id, code: r.district_code!, name: r.district_name! } : null,
  lastDate: r.last_date,
  days: Number(r.days ?? 0),
});

export const presentUpload = (u: WeatherUploadEntity, issueCount: number): UploadDto => ({
  id: u.id,
  source: u.source,
  fileName: u.fileName,
  status: u.status,
  tempUnit: u.tempUnit,
  rainUnit: u.rainUnit,
  bytesTotal: Number(u.bytesTotal),
  bytesProcessed: Number(u.bytesProcessed),
  rowsProcessed: u.rowsProcessed,
  rowsAccepted: u.rowsAccepted,
  rowsFlagged: u.rowsFlagged,
  rowsRejected: u.rowsRejected,
  rowsReplaced: u.rowsReplaced,
  rowsHeld: u.rowsHeld ?? 0,
  rowsConflicting: u.rowsConflicting ?? 0,
  issueCount,
  message: capText(u.message),
  reasonCode: u.reasonCode ?? null,
  reasonParams: u.reasonParams ?? null,
  createdAt: u.createdAt.toISOString(),
  finishedAt: u.finishedAt ? u.finishedAt.toISOString() : null,
});
