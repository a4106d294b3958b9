import { Link } from 'react-router-dom';
import { PageHeading } from '../components/page-heading';

export function NotFoundPage() {
  return (
    <section aria-labelledby="page-title" className="max-w-prose">
      <PageHeading>Page not found</PageHeading>
      <p className="mt-3">There is no Broodcast screen at this address. The link may be old or mistyped.</p>
      <p className="mt-4">
        <Link to="/" className="link">
          Back to the Ladder
        </Link>
      </p>
    </section>
  );
}
