import { useTranslation } from 'react-i18next';
import { PageHeading } from '../../components/page-heading';
import { FormMessage } from '../../components/form';
import { isForbidden } from '../../lib/api-client';
import { errorText } from '../../lib/error-text';
import { NotAllowedPage } from '../../app/not-allowed.page';
import { useUsers } from './api/users.api';
import { InviteUserForm } from './components/invite-user.form';
import { UsersTable } from './components/users.table';

export function UsersAdminPage() {
  const { t } = useTranslation('users');
  const users = useUsers();
  if (isForbidden(users.error)) return <NotAllowedPage />;
  return (
    <section aria-labelledby="page-title">
      <PageHeading lead={t('page.lead')}>{t('page.title')}</PageHeading>
      <div className="space-y-8">
        <div className="min-w-0">
          {users.isPending ? (
            <p className="text-ink-muted">{t('page.loading')}</p>
          ) : users.isError ? (
            <FormMessage kind="error">{errorText(users.error)}</FormMessage>
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
