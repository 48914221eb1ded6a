// ESLint flat config: Next's rules (Core Web Vitals and its TypeScript set, which brings
// typescript-eslint, React, hooks, jsx-a11y and import), Drizzle's update/delete-with-where rules,
// and Prettier's config last so formatting is Prettier's alone (`prettier --check` runs in `npm run lint`).
import nextVitals from 'eslint-config-next/core-web-vitals';
import nextTypescript from 'eslint-config-next/typescript';
import drizzle from 'eslint-plugin-drizzle';
import prettier from 'eslint-config-prettier/flat';

const config = [
  {
    ignores: [
      'node_modules/**',
      '.next/**',
      '.next-*/**',
      '.data/**',
      'backups/**',
      'drizzle/**',
      'next-env.d.ts',
      'tests/e2e/screenshots/**',
    ],
  },
  ...nextVitals,
  ...nextTypescript,
  {
    plugins: { drizzle },
    rules: {
      // Every Drizzle update and delete names its rows: `db` or a transaction `tx`.
      'drizzle/enforce-update-with-where': ['error', { drizzleObjectName: ['db', 'tx'] }],
      'drizzle/enforce-delete-with-where': ['error', { drizzleObjectName: ['db', 'tx'] }],
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  prettier,
];

export default config;
