import { Link } from 'react-router-dom';
import { PageHeading } from '../components/page-heading';

/** Shown, inside the layout, for a screen the signed-in role may not use (and for any 403). */
export function NotAllowedPage() {
  return (
    <section aria-labelledby="page-title" className="max-w-prose">
      <PageHeading>Not allowed</PageHeading>
      <p className="mt-3">
        Your role does not give access to this screen. If you need it for your work, ask an admin of your
        Broodcast deployment to change your role.
      </p>
      <p className="mt-4">
        <Link to="/" className="link">
          Back to the Ladder
        </Link>
      </p>
    </section>
  );
}
