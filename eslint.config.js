// One lint configuration for the whole repository (client, server, shared, optimizer, tests).
import js from '@eslint/js';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', '.data/**', '.tmp/**', 'drizzle/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      '@typescript-eslint/no-explicit-any': 'off',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  {
    files: ['src/**/*.tsx', 'src/**/*.ts'],
    plugins: { 'react-hooks': reactHooks },
    rules: { 'react-hooks/rules-of-hooks': 'error', 'react-hooks/exhaustive-deps': 'warn' },
  },
  {
    // optimizer/ is pure computation: nothing of the project outside it, and no I/O modules.
    files: ['optimizer/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: ['../server/*', '../../server/*', '../shared/*', '../../shared/*', '../src/*', '../../src/*'], message: 'optimizer/ imports nothing of the project' },
            { group: ['node:*', 'fs', 'pg', 'express', 'zod'], message: 'optimizer/ does no I/O and uses no zod' },
          ],
        },
      ],
    },
  },
  {
    // shared/ imports only zod.
    files: ['shared/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', { patterns: [{ group: ['../server/*', '../src/*', '../optimizer/*', '../../*'], message: 'shared/ imports only zod' }] }],
    },
  },
  {
    // The server never imports the client.
    files: ['server/**/*.ts'],
    rules: { 'no-restricted-imports': ['error', { patterns: [{ group: ['../src/*', '../../src/*', '../../../src/*'], message: 'server/ never imports src/' }] }] },
  },
);
