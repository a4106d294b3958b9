import { addBundledResources } from '../../../src/i18n';

// The client tests render at once, without waiting for the texts' chunks: every language and namespace is
// bundled here and added before any test (the app itself loads them lazily, src/i18n/index.ts).
addBundledResources(import.meta.glob<{ default: Record<string, unknown> }>('../../../src/i18n/locales/*/*.json', { eager: true }));
