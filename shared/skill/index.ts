/** Skill of the tier against outcomes: pure scoring, events and null models (docs/skill.md). */
export * from './scores';
export * from './events';
export * from './report';
