import js from '@eslint/js';
import globals from 'globals';
import reactHooks from 'eslint-plugin-react-hooks';
import reactRefresh from 'eslint-plugin-react-refresh';
import tseslint from 'typescript-eslint';

export default tseslint.config(
  { ignores: ['dist', '.data', 'coverage', 'node_modules'] },
  {
    extends: [js.configs.recommended, ...tseslint.configs.recommended],
    files: ['**/*.{ts,tsx,js}'],
    languageOptions: { ecmaVersion: 2023, globals: { ...globals.node } },
    rules: {
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_' },
      ],
      '@typescript-eslint/consistent-type-imports': 'error',
      'no-console': ['error', { allow: ['warn', 'error'] }],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { 'react-hooks': reactHooks, 'react-refresh': reactRefresh },
    rules: {
      ...reactHooks.configs.recommended.rules,
      // Screen modules export their Component together with a createLoader factory.
      'react-refresh/only-export-components': [
        'warn',
        { allowConstantExport: true, allowExportNames: ['createLoader'] },
      ],
      // The browser may share the API's zod schemas, and nothing else from the server.
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '^@server/(?!schema/|calc/|[a-z-]+/schema$)',
              message:
                'Import only server/**/schema.ts, server/schema/* or the pure server/calc/* into the client.',
            },
          ],
        },
      ],
    },
  },
  {
    // Command-line entry points and benchmarks print to the terminal on purpose.
    files: ['server/cli/**', 'bench/**', 'server/fakes/**'],
    rules: { 'no-console': 'off' },
  },
);
