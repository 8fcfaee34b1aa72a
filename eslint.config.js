// Lint: typescript-eslint's recommended rules plus the project's import boundaries
// (calc imports nothing of ours; the client imports only the server's contract folder, through @contract;
// features stay apart).
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import importPlugin from 'eslint-plugin-import';
import globals from 'globals';
import { readdirSync } from 'node:fs';

const noOurs = (patterns, message) => ['error', { patterns: patterns.map((group) => ({ group, message })) }];

// Features do not import each other; app/routes compose them. The one exception is deliberate:
// the walk-through shows the loads feature's live panels. Entities (client/src/entities/<record>/: records'
// keys, queries, paths, labels and ports) are shared by features and import none of them.
const features = readdirSync(new URL('./client/src/features', import.meta.url)).filter((f) => !f.includes('.'));
const allowed = { walkthrough: ['loads'] };
const featureBoundaries = features.map((feature) => {
  const others = features.filter((f) => f !== feature && !(allowed[feature] ?? []).includes(f));
  return {
    files: [`client/src/features/${feature}/**/*.{ts,tsx}`],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: `^(\\.\\./)+(${others.join('|')})/`,
              message: 'Features do not import each other; share through lib/ or compose in app/routes.',
            },
            {
              group: ['**/server/**', 'node:*'],
              message: "The client imports only the server's contract, through @contract.",
            },
          ],
        },
      ],
    },
  };
});

const entityBoundary = {
  files: ['client/src/entities/**/*.{ts,tsx}'],
  rules: {
    'no-restricted-imports': [
      'error',
      {
        patterns: [
          { group: ['**/features/**', '**/app/**'], message: 'Entities are shared by the features: they import none.' },
          {
            group: ['**/server/**', 'node:*'],
            message: "The client imports only the server's contract, through @contract.",
          },
        ],
      },
    ],
  },
};

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', '.data/**', 'coverage/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      '@typescript-eslint/no-explicit-any': 'error',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/no-namespace': 'off',
    },
  },
  {
    files: ['calc/**/*.ts'],
    rules: {
      'no-restricted-imports': noOurs(
        [['**/client/**', '**/server/**', '**/scripts/**', '**/fixtures/**', 'node:*', 'fs', 'path', 'http']],
        'calc is pure: it imports only zod, mathjs, convert-units and its own files.',
      ),
      'no-restricted-globals': [
        'error',
        { name: 'fetch', message: 'calc does no I/O.' },
        { name: 'Date', message: 'calc has no clock.' },
      ],
      'no-restricted-properties': ['error', { object: 'Math', property: 'random', message: 'calc has no randomness.' }],
    },
  },
  {
    files: ['client/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: {
      ...reactHooks.configs.recommended.rules,
      'no-restricted-imports': noOurs(
        [['**/server/**', '../../server/*', 'node:*']],
        "The client imports only the server's contract, through @contract.",
      ),
    },
  },
  ...featureBoundaries,
  entityBoundary,
  {
    files: ['server/**/*.{ts,tsx}'],
    rules: { 'no-restricted-imports': noOurs([['**/client/**']], 'The server does not import client code.') },
  },
  {
    // Server layering: no import cycles (between modules or anywhere), and lib/ never reaches into a module.
    files: ['server/**/*.{ts,tsx}'],
    plugins: { import: importPlugin },
    settings: {
      'import/resolver': { node: { extensions: ['.ts', '.tsx', '.js'] } },
      'import/parsers': { '@typescript-eslint/parser': ['.ts', '.tsx'] },
      'import/extensions': ['.ts', '.tsx', '.js'],
    },
    rules: {
      'import/no-cycle': ['error', { ignoreExternal: true }],
      'import/no-restricted-paths': [
        'error',
        {
          zones: [
            {
              target: './server/src/lib',
              from: './server/src/modules',
              message: 'lib/ is shared by the modules: it never imports one (move the shared piece into lib/).',
            },
          ],
        },
      ],
    },
  },
  {
    // The contract (alias @contract) is the one folder of the server the client imports: it stays pure.
    files: ['server/src/contract/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '^(?!zod$|@calc$|\\./)',
              message: 'The contract imports only zod, @calc and its own files (the client imports it).',
            },
          ],
        },
      ],
      'no-restricted-globals': [
        'error',
        { name: 'fetch', message: 'The contract does no I/O.' },
        { name: 'Date', message: 'The contract has no clock.' },
      ],
    },
  },
);
