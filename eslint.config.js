// ESLint flat config: typescript-eslint's recommended rules and the React hooks rules (including the React
// Compiler checks: no state set synchronously in effects, no refs read during render, no impure calls such as
// Date.now() during render), with zero warnings allowed (`npm run lint`). The folder rules below keep the layers
// of DEVELOPERS.md: core stays pure, the UI reaches storage and the phone only through src/data and src/sensors.
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';

const frameworkInCore = [
  { group: ['react', 'react-dom', 'react/*', 'react-dom/*', 'react-router', 'react-router-dom'], message: 'src/core is pure computation: no UI framework.' },
  { group: ['@ionic/*'], message: 'src/core is pure computation: no UI framework.' },
  { group: ['@capacitor/*'], message: 'src/core is pure computation: sensors live in src/sensors.' },
  { group: ['dexie', 'dexie-react-hooks'], message: 'src/core is pure computation: storage lives in src/data.' },
];

export default tseslint.config(
  { ignores: ['dist/', 'android/', 'ios/', 'node_modules/', 'test/e2e/artifacts/', 'dev-dist/', '.phone/', 'coverage/', 'dist-cli/'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.browser, ...globals.node } },
    linterOptions: { reportUnusedDisableDirectives: 'error' },
    rules: {
      // Off: the input checks match control characters on purpose, to refuse or strip them (CSV, names, notes).
      'no-control-regex': 'off',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: reactHooks.configs.recommended.rules,
  },
  {
    files: ['src/core/**/*.ts'],
    rules: { 'no-restricted-imports': ['error', { patterns: frameworkInCore }] },
  },
  {
    files: ['src/ui/**/*.{ts,tsx}'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: ['dexie', 'dexie-react-hooks'], message: 'The UI reaches the database through src/data.' },
            { group: ['@capacitor/*'], message: 'The UI reaches the phone through src/sensors.' },
          ],
        },
      ],
    },
  },
);
