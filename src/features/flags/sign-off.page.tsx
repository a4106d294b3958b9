import { FormMessage } from '../../components/form';
import { PageHeading } from '../../components/page-heading';
import { useFlags } from './api/flags.api';
import { DecisionForm } from './components/decision.form';
import { FlagSummary } from './components/flag-summary';

/** The sign-off queue (supervisor): open flags, highest tier first, then newest; decide each in place. */
export function SignOffPage() {
  const flags = useFlags('open');
  return (
    <section aria-labelledby="page-title">
      <PageHeading lead="Flags are proposed warnings, raised by the season run or by health staff. Approve one (after editing its message if needed) and it becomes an advisory, mailed at once to the district’s subscribers. Reject it with a reason. Nobody signs off a flag they raised.">
        Sign-off
      </PageHeading>
      {flags.isPending ? (
        <p className="text-ink-muted">Loading the queue…</p>
      ) : flags.isError ? (
        <FormMessage kind="error">{flags.error.message}</FormMessage>
      ) : flags.data.length === 0 ? (
        <p className="card">No flag is waiting for sign-off.</p>
      ) : (
        <ol className="space-y-4" aria-label="Flags waiting for sign-off">
          {flags.data.map((flag) => (
            <li key={flag.id} className="card space-y-3">
              <FlagSummary flag={flag} linkToPage />
              <DecisionForm flag={flag} />
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
