// ESLint 9 flat config: typescript-eslint, React hooks, TanStack Query, and the architecture
// boundaries of CONVENTIONS.md (src/shared imports nothing of the app; server/ takes only
// src/shared from the client; features do not import each other; migrations import no app code).
import js from '@eslint/js';
import pluginQuery from '@tanstack/eslint-plugin-query';
import boundaries from 'eslint-plugin-boundaries';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

const el = (...types) => ({ element: { type: types } });
const to = (...types) => ({ to: el(...types) });

export default tseslint.config(
  { ignores: ['node_modules/', 'dist/', 'dist-test/', '.data/', 'coverage/'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  ...pluginQuery.configs['flat/recommended'],
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/consistent-type-imports': ['error', { fixStyle: 'inline-type-imports' }],
      'no-console': 'off',
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: { 'react-hooks/rules-of-hooks': 'error', 'react-hooks/exhaustive-deps': 'error' },
  },
  {
    files: ['migrations/**/*.ts'],
    // Migrations are frozen in time: untyped Kysely<any>, and no app code.
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
  {
    files: ['**/*.{ts,tsx}'],
    plugins: { boundaries },
    settings: {
      'import/resolver': { node: { extensions: ['.ts', '.tsx', '.js', '.mjs', '.json'] } },
      'boundaries/include': ['src/**/*', 'server/**/*', 'migrations/**/*', 'fakes/**/*', 'scripts/**/*', 'tests/**/*'],
      'boundaries/elements': [
        { type: 'shared', pattern: 'src/shared' },
        { type: 'lib', pattern: 'src/lib' },
        { type: 'ui', pattern: 'src/components' },
        { type: 'feature', pattern: 'src/features/*', capture: ['featureName'] },
        { type: 'app', pattern: ['src/app', 'src/routes'] },
        { type: 'server', pattern: 'server' },
        { type: 'migration', pattern: 'migrations' },
        { type: 'tooling', pattern: ['fakes', 'scripts', 'tests'] },
      ],
      'boundaries/files': [{ category: 'entry', pattern: ['src/main.tsx', 'src/entry-server.tsx'] }],
    },
    rules: {
      'boundaries/dependencies': [
        'error',
        {
          default: 'allow',
          policies: [
            {
              from: el('shared'),
              disallow: to('lib', 'ui', 'feature', 'app', 'server', 'migration', 'tooling'),
              message: 'src/shared imports nothing of the app',
            },
            { from: el('lib', 'ui'), disallow: to('feature', 'app', 'server', 'migration', 'tooling') },
            { from: el('feature'), disallow: to('app', 'server', 'migration', 'tooling') },
            {
              from: el('feature'),
              disallow: { to: { element: { type: 'feature', captured: { featureName: '!{{ from.element.captured.featureName }}' } } } },
              message: 'features do not import each other; compose them in a route',
            },
            {
              from: el('server'),
              disallow: to('lib', 'ui', 'feature', 'migration', 'tooling'),
              message: 'server/ takes only src/shared (and the SSR entry) from the client',
            },
            {
              from: el('migration'),
              disallow: to('shared', 'lib', 'ui', 'feature', 'app', 'server', 'tooling'),
              message: 'migrations never import app code',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['**/*.test.{ts,tsx}', 'tests/**/*.ts'],
    rules: { '@typescript-eslint/no-non-null-assertion': 'off' },
  },
);
