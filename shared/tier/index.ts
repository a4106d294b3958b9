export * from './tier-settings';
export * from './tier';
export * from './driver-shares';
