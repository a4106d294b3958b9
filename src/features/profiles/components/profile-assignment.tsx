import { useTranslation } from 'react-i18next';
import type { DistrictFileResponse } from '../../../../shared/api/board.schema';
import { useFormat } from '../../../i18n/format';

/** The District file's list of assigned vector profiles: biofix, who assigned them and when. */
export function ProfileAssignment({ profiles }: { profiles: DistrictFileResponse['profiles'] }) {
  const { t } = useTranslation('profiles');
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
              {t('file.row', { profile: p.profileName, biofix: p.biofix ?? t('file.default', { date: p.defaultBiofix ?? '' }) })}
              {' · '}
              {p.assignedBy && p.assignedAt ? t('file.by', { who: p.assignedBy, when: f.dateTime(p.assignedAt) }) : t('file.seed')}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
