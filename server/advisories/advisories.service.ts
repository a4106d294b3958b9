import { ACTION_CAUTION, type AdvisoryDto } from '../../shared/api/flags.schema';
import type { AppContext } from '../app-context';
import { ADVISORY_MESSAGE_COLUMNS, advisoryComposed } from '../flags/flags.presenter';
import { assertDistrictVisible, type Principal, seesAllDistricts } from '../auth/principal';

/** Advisories as the people of a district received them; community workers see their own districts'. */
export class AdvisoriesService {
  constructor(private readonly ctx: AppContext) {}

  async list(p: Principal, query: { districtId?: string }): Promise<{ advisories: AdvisoryDto[] }> {
    if (query.districtId) assertDistrictVisible(p, query.districtId);
    const rows: any[] = await this.ctx.ds.query(
      `SELECT a.*, ${ADVISORY_MESSAGE_COLUMNS}, d.code AS district_code, u.display_name AS issuer_name, a.expires_at > now() AS current,
              (SELECT count(*)::int FROM outbox_messages m WHERE m.advisory_id = a.id) AS recipients
         FROM advisories a JOIN districts d ON d.id = a.district_id LEFT JOIN users u ON u.id = a.issued_by
         LEFT JOIN flags f ON f.id = a.flag_id
        WHERE ($1::uuid IS NULL OR a.district_id = $1) AND ($2::uuid[] IS NULL OR a.district_id = ANY($2))
        ORDER BY a.issued_at DESC LIMIT 500`,
      [query.districtId ?? null, seesAllDistricts(p) ? null : p.districtIds],
    );
    return {
      advisories: rows.map((r) => ({
        id: r.id, flagId: r.flag_id, districtId: r.district_id, districtCode: r.district_code, districtName: r.district_name,
        tier: r.tier, message: r.message, composed: advisoryComposed(r), actions: r.actions, caution: ACTION_CAUTION,
        issuedBy: r.issued_by ? { id: r.issued_by, displayName: r.issuer_name ?? '' } : null,
        issuedAt: new Date(r.issued_at).toISOString(), expiresAt: new Date(r.expires_at).toISOString(), current: r.current, recipients: r.recipients,
      })),
    };
  }
}
