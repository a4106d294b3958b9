import { useTranslation } from 'react-i18next';
import type { DistrictFileResponse } from '../../../../shared/api/board.schema';
import { useFormat } from '../../../i18n/format';
import { profileLabel } from '../../district-file/district-file-format';

/** A biofix MM-DD as the interface language writes a day and month (e.g. "1 juin"), or the text as given. */
export function monthDayText(mmdd: string, locale: string): string {
  const m = /^(\d{2})-(\d{2})$/.exec(mmdd);
  if (!m) return mmdd;
  return new Intl.DateTimeFormat(locale, { day: 'numeric', month: 'long', timeZone: 'UTC' }).format(new Date(Date.UTC(2001, Number(m[1]) - 1, Number(m[2]))));
}

/** The District file's list of assigned vector profiles: biofix, who assigned them and when. */
export function ProfileAssignment({ profiles }: { profiles: DistrictFileResponse['profiles'] }) {
  const { t } = useTranslation(['profiles', 'district-file']);
  const f = useFormat();
  return (
    <section aria-labelledby="district-profiles-title" className="card">
      <h2 id="district-profiles-title" className="section-title">{t('file.title')}</h2>
      {profiles.length === 0 ? (
        <p className="mt-2 text-sm">{t('file.none')}</p>
      ) : (
        <ul className="mt-2 list-disc space-y-1 pl-5 text-sm">
          {profiles.map((p) => (
            <li key={p.profileId}>
              {t('file.row', {
                profile: profileLabel({ t }, p),
                biofix: p.biofix ? monthDayText(p.biofix, f.locale) : t('file.default', { date: monthDayText(p.defaultBiofix ?? '', f.locale) }),
              })}
              {' · '}
              {p.assignedBy && p.assignedAt ? t('file.by', { who: p.assignedBy, when: f.dateTime(p.assignedAt) }) : t('file.seed')}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
