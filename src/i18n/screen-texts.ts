/**
 * The text namespaces (src/i18n/locales/<language>/<namespace>.json) that each lazily loaded screen uses,
 * itself and everything it imports, beyond BASE_NAMESPACES. src/app/router.tsx loads them in the user's
 * language together with the screen's code, in parallel, so a screen never waits for its code and then for
 * its texts. tests/unit/screen-texts.test.ts reads the source and fails when a screen uses a namespace
 * that is not listed here: add it when a screen starts using another feature's texts.
 */
export const BASE_NAMESPACES = ['common', 'app', 'components'] as const;

export const SCREEN_TEXTS = {
  'app/app-layout': [],
  'features/auth/sign-in.page': ['auth'],
  'features/auth/password-reset-request.page': ['auth'],
  'features/auth/password-reset-confirm.page': ['auth'],
  'features/auth/invite-accept.page': ['auth'],
  'features/subscriptions/unsubscribe.page': ['auth', 'subscriptions'],
  'features/ladder/ladder.page': ['cautions', 'districts', 'flags', 'help', 'ladder', 'region-map'],
  'features/users/users-admin.page': ['users'],
  'features/districts/districts-admin.page': ['districts', 'profiles'],
  'features/profiles/profiles.page': ['district-file', 'ladder', 'profiles'],
  'features/tier-settings/tier-settings.page': ['field-week', 'tier-settings'],
  'features/cases/case-ledger.page': ['cases', 'districts'],
  'features/cases/district-cases.page': ['cases', 'cautions', 'districts', 'surveys'],
  'features/surveys/surveys.page': ['cautions', 'surveys'],
  'features/district-file/print/district-print.page': ['cautions', 'district-file', 'districts', 'help', 'ladder'],
  'features/district-file/district-file.page': ['cautions', 'district-file', 'districts', 'field-log', 'field-week', 'flags', 'help', 'ladder', 'profiles'],
  'features/season-runs/season-runs.page': ['season-runs'],
  'features/look-back/look-back.page': ['look-back', 'cautions'],
  'features/field-week/field-week.page': ['field-week'],
  'features/field-log/field-log.page': ['cautions', 'field-log', 'field-week'],
  'features/weather/intake.page': ['weather'],
  'features/weather/stations.page': ['weather'],
  'features/weather/district-weather.page': ['weather'],
  'features/flags/sign-off.page': ['flags', 'ladder'],
  'features/flags/raise-flag.page': ['flags'],
  'features/flags/flag.page': ['flags', 'ladder'],
  'features/flags/advisories.page': ['cautions', 'flags', 'ladder'],
  'features/bulletins/bulletin.page': ['bulletins'],
  'features/subscriptions/preferences.page': ['subscriptions'],
  'features/settings/settings.page': ['settings'],
} as const satisfies Record<string, readonly string[]>;

export type ScreenModule = keyof typeof SCREEN_TEXTS;
