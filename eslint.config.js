import tseslint from 'typescript-eslint';

export default tseslint.config(
  { ignores: ['dist/**', 'deploy/**', 'node_modules/**', 'demo/**', 'coverage/**', 'test-output/**'] },
  ...tseslint.configs.recommended,
  {
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      'no-console': 'off',
      'no-eval': 'error',
      'no-new-func': 'error',
    },
  },
  {
    // The engine is pure: no Office, DOM-only or Node-only modules, and nothing from the outer layers.
    files: ['src/**/*.ts'],
    ignores: ['src/cli/**'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: ['**/functions/**', '**/addin/**', '**/cli/**'], message: 'src/ must not import the outer layers' },
            { group: ['node:*', 'fs', 'path', 'os', 'child_process', 'office-js', '@microsoft/*'], message: 'src/ is pure TypeScript' },
          ],
        },
      ],
      'no-restricted-globals': ['error', 'Office', 'Excel', 'document', 'window', 'process'],
    },
  },
);
