export * from './tier-settings';
export * from './tier';
