// ESLint for Broodcast, run by `npm test` (scripts/guard-rails.ts). Type-aware rules only where they
// catch real faults (no-self-compare stays off: `x !== x` is the model's fast NaN test): a promise nobody awaits or catches rejects unobserved (the process guards then stop
// the server), and awaiting a non-promise hides a missing call. Formatting is not linted here.
import tseslint from 'typescript-eslint';

export default tseslint.config(
  { ignores: ['node_modules/**', 'dist/**', '.local/**', 'public/**', 'coverage/**'] },
  {
    files: ['**/*.ts', '**/*.tsx'],
    languageOptions: {
      parser: tseslint.parser,
      parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname },
    },
    plugins: { '@typescript-eslint': tseslint.plugin },
    linterOptions: { reportUnusedDisableDirectives: 'error' },
    rules: {
      '@typescript-eslint/no-floating-promises': ['error', { ignoreIIFE: false, ignoreVoid: true }],
      '@typescript-eslint/await-thenable': 'error',
      '@typescript-eslint/no-misused-promises': ['error', { checksVoidReturn: false }],
      'no-debugger': 'error',
      'no-dupe-keys': 'error',
      'no-unreachable': 'error',
    },
  },
);
