import { Link } from 'react-router-dom';
import { FormMessage } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { useSession } from '../../app/session';
import { TierBadge } from '../ladder/components/tier-badge';
import { CautionsPanel } from '../cautions/cautions-panel';
import { useAdvisories } from './api/advisories.api';
import { formatWhen } from './flag-format';

/** Every advisory sent (a community worker: their district's), newest first, with the current ones marked. */
export function AdvisoriesPage() {
  const me = useSession();
  const advisories = useAdvisories();
  return (
    <section aria-labelledby="page-title">
      <PageHeading lead="An advisory is a flag a supervisor approved, as it was mailed to the people of the district. It stays current for four weeks and appears in every weekly bulletin meanwhile.">
        Advisories
      </PageHeading>
      <p className="mb-4 flex flex-wrap gap-4 text-sm">
        <Link className="link" to="/preferences">
          Choose which districts you receive by mail
        </Link>
        {me.role === 'officer' || me.role === 'epidemiologist' ? (
          <Link className="link" to="/flags/new">
            Raise a flag
          </Link>
        ) : null}
      </p>
      {advisories.isPending ? (
        <p className="text-ink-muted">Loading advisories…</p>
      ) : advisories.isError ? (
        <FormMessage kind="error">{advisories.error.message}</FormMessage>
      ) : advisories.data.length === 0 ? (
        <p className="card">No advisory has been sent yet.</p>
      ) : (
        <ul className="space-y-4">
          {advisories.data.map((a) => (
            <li key={a.id} className="card space-y-2">
              <div className="flex flex-wrap items-center gap-3">
                <h2 className="section-title !mb-0">
                  {a.districtName} ({a.districtCode})
                </h2>
                {a.tier ? <TierBadge tier={a.tier} /> : null}
                <span className="status">{a.current ? 'Current' : 'Past'}</span>
              </div>
              <p className="text-sm text-ink-muted">
                Sent {formatWhen(a.issuedAt)}
                {a.issuedBy ? `, signed off by ${a.issuedBy.displayName}` : ''} · to {a.recipients} subscriber{a.recipients === 1 ? '' : 's'}
                {me.role !== 'worker' ? (
                  <>
                    {' '}·{' '}
                    <Link className="link" to={`/flags/${a.flagId}`}>
                      the flag and its history
                    </Link>
                  </>
                ) : null}
              </p>
              <p>{a.message}</p>
              <ul className="list-disc space-y-1 pl-5 text-sm">
                {a.actions.map((x) => (
                  <li key={x.id}>
                    <strong>{x.title}.</strong> {x.text}
                  </li>
                ))}
              </ul>
              <p className="text-sm italic">{a.caution}</p>
            </li>
          ))}
        </ul>
      )}
      <CautionsPanel className="mt-6" />
    </section>
  );
}
