/** The Case outlook (docs/outlook.md): the pure model, its forecast, its scores and its rolling-origin skill. */
export * from './outlook';
export * from './scores';
