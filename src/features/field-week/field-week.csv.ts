import type { FieldWeekDto } from '../../../shared/api/field.schema';
import { toCsv } from '../../lib/csv';

/**
 * The week's plan as CSV, one row per team and day with a district: day (YYYY-MM-DD), team, district code
 * and name, its tier and the work needed there, in the words given (the interface language).
 */
export function fieldWeekCsv(
  week: FieldWeekDto,
  words: { header: readonly string[]; tier: (tier: string | null) => string; kind: (kind: string) => string },
): string {
  const team = new Map(week.teams.map((t) => [t.id, t.name]));
  const district = new Map(week.districts.map((d) => [d.districtId, d]));
  const rows = [...week.days]
    .sort((a, b) => a.day.localeCompare(b.day) || (team.get(a.teamId) ?? '').localeCompare(team.get(b.teamId) ?? ''))
    .map((d) => {
      const info = district.get(d.districtId);
      return [d.day, team.get(d.teamId) ?? d.teamId, info?.code ?? '', info?.name ?? d.districtId, words.tier(info?.tier ?? null), (info?.workNeeded ?? []).map(words.kind).join('; ')];
    });
  return toCsv(words.header, rows);
}
