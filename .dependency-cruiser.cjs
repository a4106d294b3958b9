/**
 * Layer rules for Broodcast, checked by `npm test` (scripts/guard-rails.ts) with dependency-cruiser.
 * The layers (DEVELOPERS.md § Layout): shared/ is pure and imports no other layer; the client (src/)
 * never imports the server or jobs; the server never imports the client; server/platform/ is used by
 * features and uses none; production code never imports tests; no module cycles.
 * Not (yet) a rule: "features reach each other only through their public files" — the feature folders
 * have no index files to name as public, so the rule would have nothing to point at.
 */
/** @type {import('dependency-cruiser').IConfiguration} */
module.exports = {
  forbidden: [
    {
      name: 'shared-is-pure',
      comment: 'shared/ holds schemas and the pure model: it imports no other layer of the project.',
      severity: 'error',
      from: { path: '^shared/' },
      to: { path: '^(src|server|jobs|scripts|cli|bench|tests)/' },
    },
    {
      name: 'client-never-imports-server',
      comment: 'The browser bundle must not pull in server code (secrets, database, Node APIs).',
      severity: 'error',
      from: { path: '^src/' },
      to: { path: '^(server|jobs|scripts|cli)/' },
    },
    {
      name: 'server-never-imports-client',
      severity: 'error',
      from: { path: '^(server|jobs)/' },
      to: { path: '^src/' },
    },
    {
      name: 'platform-uses-no-feature',
      comment: 'server/platform/ is the layer features build on (database, locks, mail, outbox, errors).',
      severity: 'error',
      from: { path: '^server/platform/' },
      to: { path: '^server/', pathNot: '^server/(platform|db|config|i18n)/' },
    },
    {
      name: 'no-circular',
      comment: 'A cycle between modules makes both hard to change; break it through a platform or shared module.',
      severity: 'error',
      from: {},
      // Type-only imports vanish at run time (a render module naming its data's type is no cycle).
      to: { circular: true, viaOnly: { dependencyTypesNot: ['type-only'] } },
    },
    {
      name: 'production-not-from-tests',
      severity: 'error',
      from: { path: '^(src|server|shared|jobs)/' },
      to: { path: '^tests/' },
    },
  ],
  options: {
    doNotFollow: { path: 'node_modules' },
    exclude: { path: '(^node_modules|^dist|\\.local)/' },
    tsPreCompilationDeps: true,
    tsConfig: { fileName: 'tsconfig.json' },
    enhancedResolveOptions: { exportsFields: ['exports'], conditionNames: ['import', 'require', 'node', 'default'] },
  },
};
