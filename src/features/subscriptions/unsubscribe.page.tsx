import { useEffect } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { Trans, useTranslation } from 'react-i18next';
import { FormMessage } from '../../components/form';
import { i18n } from '../../i18n';
import { errorText } from '../../lib/error-text';
import { AuthShell } from '../auth/components/auth-shell';
import { useUndoUnsubscribe, useUnsubscribe, useUnsubscribeLink } from './api/subscriptions.api';

/**
 * The landing page of the unsubscribe link in every mail: no sign-in, in the reader's language. Opening it
 * changes nothing (mail scanners open every link): it asks first, and the change is the POST of its button.
 * Once stopped, the page offers undo. Mail programs that offer their own button post to the API directly
 * (List-Unsubscribe-Post, RFC 8058).
 */
export function UnsubscribePage() {
  const { t } = useTranslation('subscriptions');
  const [params] = useSearchParams();
  const token = params.get('token');
  const link = useUnsubscribeLink(token);
  const stop = useUnsubscribe();
  const undo = useUndoUnsubscribe();
  const language = link.data?.language;
  useEffect(() => {
    // The page speaks the reader's language (for this visit only: nothing is remembered on the device).
    if (language && i18n.language !== language) {
      void i18n.changeLanguage(language);
      document.documentElement.lang = language;
    }
  }, [language]);

  const state = undo.data ?? stop.data ?? link.data;
  const vars = state ? { email: state.email, district: state.districtName ?? '' } : {};
  const error = link.error ?? stop.error ?? undo.error;
  return (
    <AuthShell title={t('unsubscribe.title')}>
      {!token ? (
        <FormMessage kind="error">{t('unsubscribe.noToken')}</FormMessage>
      ) : link.isPending ? (
        <p>{t('unsubscribe.loading')}</p>
      ) : !state ? (
        <FormMessage kind="error">{errorText(error)}</FormMessage>
      ) : (
        <div className="space-y-4">
          {error && <FormMessage kind="error">{errorText(error)}</FormMessage>}
          {undo.isSuccess ? (
            <FormMessage kind="success">{t('unsubscribe.undone', vars)}</FormMessage>
          ) : stop.isSuccess ? (
            <FormMessage kind="success">{t(state.scope === 'bulletin' ? 'unsubscribe.doneBulletin' : 'unsubscribe.done', vars)}</FormMessage>
          ) : state.subscribed ? (
            <p>{t(state.scope === 'bulletin' ? 'unsubscribe.askBulletin' : 'unsubscribe.askDistrict', vars)}</p>
          ) : (
            <FormMessage kind="info">{t('unsubscribe.alreadyStopped', vars)}</FormMessage>
          )}
          {state.subscribed && !stop.isSuccess && !undo.isSuccess ? (
            <button type="button" className="btn btn-primary w-full" disabled={stop.isPending} onClick={() => stop.mutate(token)}>
              {stop.isPending ? t('unsubscribe.stopping') : t('unsubscribe.confirm')}
            </button>
          ) : !state.subscribed && !undo.isSuccess ? (
            <button type="button" className="btn w-full" disabled={undo.isPending} onClick={() => undo.mutate(token)}>
              {undo.isPending ? t('unsubscribe.undoing') : t('unsubscribe.undo')}
            </button>
          ) : null}
        </div>
      )}
      <p className="mt-4 text-sm">
        <Trans t={t} i18nKey="unsubscribe.choose" components={{ link: <Link className="link" to="/preferences" /> }} />
      </p>
    </AuthShell>
  );
}
