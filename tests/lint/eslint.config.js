// ESLint for the whole repository, run by `npm run lint` (and so by `npm test` and CI) as
// `eslint --config tests/lint/eslint.config.js`: with --config, patterns are relative to the
// working directory, the repository's root. It lives here because the top level is fixed.
import js from '@eslint/js';
import prettier from 'eslint-config-prettier';
import vue from 'eslint-plugin-vue';
import globals from 'globals';
import tseslint from 'typescript-eslint';

/** One `no-restricted-imports` rule from a list of [regex, why] pairs. */
const forbidImports = (...rules) => ({
  'no-restricted-imports': ['error', { patterns: rules.map(([regex, message]) => ({ regex, message })) }],
});

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', '.data/**', '.tmp/**', 'coverage/**', '**/*.d.ts'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  ...vue.configs['flat/recommended'],
  {
    files: ['**/*.vue'],
    languageOptions: { parserOptions: { parser: tseslint.parser, extraFileExtensions: ['.vue'] } },
  },
  {
    languageOptions: { ecmaVersion: 2023, sourceType: 'module', globals: { ...globals.node } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
      '@typescript-eslint/consistent-type-imports': ['error', { fixStyle: 'inline-type-imports', disallowTypeAnnotations: false }],
      eqeqeq: ['error', 'always', { null: 'ignore' }],
    },
  },
  { files: ['src/**'], languageOptions: { globals: { ...globals.browser } } },

  // The boundaries of the layout (DEVELOPERS.md, "The map").
  {
    files: ['src/**'],
    rules: forbidImports([
      String.raw`(^|/)server/(?!contracts/)`,
      'The client takes only server/contracts (through @contracts) from the server.',
    ]),
  },
  {
    files: ['server/contracts/**'],
    rules: forbidImports([String.raw`^(?!zod$|\./)`, 'Contracts are zod schemas only: they import zod and each other.']),
  },
  {
    files: ['server/domain/**'],
    rules: forbidImports(
      [String.raw`^(?!luxon$|\.)`, 'Domain rules are pure: luxon and the contracts only.'],
      [
        String.raw`(^|/)(features|db|auth|middleware|http|kernel|errors|config|openapi|scripts|dev|jobs)/`,
        'Domain rules are pure: they import other domain modules and the contracts only.',
      ],
    ),
  },
  {
    files: ['reports/**'],
    rules: forbidImports([String.raw`(^|/)server/(?!contracts/)`, 'Report builders are pure: nothing from the server but its contracts.']),
  },
  {
    files: ['server/auth/**', 'server/middleware/**', 'server/http/**', 'server/kernel/**', 'server/db/**'],
    ignores: ['server/db/seed/**', 'server/db/entities.ts'],
    rules: forbidImports([
      String.raw`(^|/)features/`,
      'The shared layers import nothing from features/: move what both need into server/kernel/.',
    ]),
  },
  {
    files: ['server/**/*.routes.ts'],
    rules: {
      'no-restricted-syntax': [
        'error',
        { selector: "CallExpression[callee.property.name='query']", message: 'Routes do HTTP only: SQL belongs in a repository.' },
        { selector: "CallExpression[callee.property.name='transaction']", message: 'Routes do HTTP only: a service owns the transaction.' },
        {
          selector: "MemberExpression[property.name='locals']",
          message: 'Take params, query, body and user from endpoint(): typed, not res.locals.',
        },
      ],
    },
  },
  prettier,
);
