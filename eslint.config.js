import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';

export default tseslint.config(
  { ignores: ['dist', 'node_modules', '.cache', '.data', 'drizzle', 'test-results'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser, ...globals.node } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: { ...reactHooks.configs.recommended.rules },
  },
  {
    // A client feature never imports another feature: routes (src/app) compose them.
    files: ['src/features/*/*/**/*.{ts,tsx}'],
    rules: {
      'no-restricted-imports': ['error', { patterns: [{ group: ['../../*/**', '!../../../**'], message: 'A feature never imports another feature; compose them in a route.' }] }],
    },
  },
  {
    // The numerical core and the contracts stay pure: no node:, no DOM frameworks, no database.
    files: ['shared/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', { patterns: ['node:*', 'drizzle-orm*', 'express', 'react*', 'pg', '../server/*', '../src/*', '../../server/*', '../../src/*'] }],
    },
  },
);
