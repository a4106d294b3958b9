import { useTranslation } from 'react-i18next';
import { PageHeading } from '../../components/page-heading';
import { FormMessage } from '../../components/form';
import { isForbidden } from '../../lib/api-client';
import { errorText } from '../../lib/error-text';
import { NotAllowedPage } from '../../app/not-allowed.page';
import type { ProfileParameterDto } from '../../../shared/api/profiles.schema';
import { useProfiles } from './api/profiles.api';
import { VariantForm } from './components/variant.form';
import { useFormat } from '../../i18n/format';
import { profileLabel } from '../district-file/district-file-format';
import { monthDayText } from './components/profile-assignment';
import { parameterName, parameterValue } from './parameter-words';

function sourceText(p: ProfileParameterDto): string {
  if (!p.source) return '';
  const s = p.source;
  return [`${s.author} (${s.year})`, s.title, s.journal, s.where].filter(Boolean).join(', ');
}


/** The profile library: every profile with each parameter, its value(s) and where the value comes from. */
export function ProfilesPage() {
  const { t } = useTranslation(['profiles', 'district-file']);
  const f = useFormat();
  const profiles = useProfiles();
  if (isForbidden(profiles.error)) return <NotAllowedPage />;
  return (
    <section aria-labelledby="page-title">
      <PageHeading lead={t('page.lead')}>{t('page.title')}</PageHeading>
      {profiles.isPending ? (
        <p className="text-ink-muted">{t('page.loading')}</p>
      ) : profiles.isError ? (
        <FormMessage kind="error">{errorText(profiles.error)}</FormMessage>
      ) : (
        <div className="space-y-8">
          <VariantForm profiles={profiles.data} />
          {profiles.data.map((p) => (
            <article key={p.id} className="card" aria-labelledby={`profile-${p.id}`}>
              <h2 id={`profile-${p.id}`} className="text-lg font-bold">
                {profileLabel({ t }, { profileId: p.kind === 'published' ? p.id : '', profileName: p.name })} <span className="text-sm text-ink-muted">({p.kind === 'published' ? t('kind.published') : t('kind.variant', { base: p.baseProfileId ? profileLabel({ t }, { profileId: p.baseProfileId, profileName: p.baseProfileId }) : '' })})</span>
              </h2>
              <p className="text-sm">{p.summary}</p>
              <p className="text-sm text-ink-muted">{t('page.defaultBiofix', { date: monthDayText(p.defaultBiofix, f.locale) })}</p>
              <div className="overflow-x-auto">
                <table className="table">
                  <thead>
                    <tr>
                      <th scope="col">{t('table.parameter')}</th>
                      <th scope="col">{t('table.central')}</th>
                      <th scope="col">{t('table.low')}</th>
                      <th scope="col">{t('table.high')}</th>
                      <th scope="col">{t('table.tag')}</th>
                      <th scope="col">{t('table.source')}</th>
                    </tr>
                  </thead>
                  <tbody>
                    {p.parameters.map((x) => (
                      <tr key={x.path}>
                        <th scope="row">
                          {parameterName(t, x.path)}
                          <code className="block text-xs font-normal text-ink-muted">{x.path}</code>
                        </th>
                        <td>{parameterValue(t, f, x)}</td>
                        <td>{x.low === null ? '' : f.number(x.low, 4)}</td>
                        <td>{x.high === null ? '' : f.number(x.high, 4)}</td>
                        <td>{t(`tag.${x.tag}`)}</td>
                        <td>{sourceText(x)}{x.note ? <span className="block text-xs text-ink-muted">{x.note}</span> : null}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            </article>
          ))}
        </div>
      )}
    </section>
  );
}
