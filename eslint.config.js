import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';

export default tseslint.config(
  {
    ignores: [
      '**/node_modules/**',
      '**/dist/**',
      'data/**',
      'coverage/**',
      'test-results/**',
      'playwright-report/**',
      'e2e/.artifacts/**',
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node } },
    rules: {
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrorsIgnorePattern: '^_' },
      ],
      '@typescript-eslint/consistent-type-imports': ['error', { fixStyle: 'inline-type-imports' }],
      eqeqeq: ['error', 'smart'],
      'no-console': 'off',
    },
  },
  {
    files: ['apps/web/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { 'react-hooks': reactHooks },
    rules: {
      ...reactHooks.configs.recommended.rules,
      // features never import each other: shared UI lives in src/components and src/lib
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['../../features/*', '../features/*', '**/features/*/**'],
              message:
                'A feature must not import another feature; move shared code to src/components or src/lib.',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['apps/web/src/app/**/*.{ts,tsx}'],
    rules: { 'no-restricted-imports': 'off' },
  },
  {
    // Amounts and dates are written by one rule (shared/src/format.ts, apps/web/src/lib/format.ts).
    files: ['apps/web/src/**/*.{ts,tsx}', 'apps/server/src/**/*.ts'],
    rules: {
      'no-restricted-syntax': [
        'error',
        ...['toFixed', 'toLocaleString', 'toLocaleDateString', 'toLocaleTimeString'].map(
          (name) => ({
            selector: `CallExpression[callee.property.name='${name}']`,
            message: `Write numbers and dates with formatQuantity/formatAmount, formatNumber or formatDate from @lotwise/shared (or apps/web/src/lib/format.ts), not .${name}().`,
          }),
        ),
        {
          selector: "NewExpression[callee.object.name='Intl'][callee.property.name='NumberFormat']",
          message:
            'Write numbers with formatQuantity, formatNumber or formatDecimal from @lotwise/shared.',
        },
      ],
    },
  },
  {
    files: ['packages/chem/src/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: ['node:*', 'fs', 'path', 'http'], message: 'packages/chem is pure: no I/O.' },
          ],
        },
      ],
    },
  },
);
