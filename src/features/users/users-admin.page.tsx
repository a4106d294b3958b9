import { PageHeading } from '../../components/page-heading';
import { FormMessage } from '../../components/form';
import { isForbidden } from '../../lib/api-client';
import { NotAllowedPage } from '../../app/not-allowed.page';
import { useUsers } from './api/users.api';
import { InviteUserForm } from './components/invite-user.form';
import { UsersTable } from './components/users.table';

export function UsersAdminPage() {
  const users = useUsers();
  if (isForbidden(users.error)) return <NotAllowedPage />;
  return (
    <section aria-labelledby="page-title">
      <PageHeading lead="Invite people, set their role and districts, and deactivate accounts that are no longer needed.">
        Users
      </PageHeading>
      <div className="space-y-8">
        <div className="min-w-0">
          {users.isPending ? (
            <p className="text-ink-muted">Loading users…</p>
          ) : users.isError ? (
            <FormMessage kind="error">{users.error.message}</FormMessage>
          ) : (
            <UsersTable users={users.data} />
          )}
        </div>
        <div className="card">
          <InviteUserForm />
        </div>
      </div>
    </section>
  );
}
