// `npm run lint`: the framework's own rules (eslint-config-next: Next.js, React, hooks, accessibility,
// imports, typescript-eslint's recommended set), as Next.js 16 documents them for a flat config.
// Formatting is Prettier's job (`npm run format`), so eslint-config-prettier goes last. Import cycles are
// refused by tests/unit/project/layout.test.ts over the whole tree, type imports included (import/no-cycle
// did the same for value imports at 87 % of this lint's time).
import { defineConfig, globalIgnores } from 'eslint/config';
import nextVitals from 'eslint-config-next/core-web-vitals';
import nextTs from 'eslint-config-next/typescript';
import prettier from 'eslint-config-prettier/flat';

export default defineConfig([
  ...nextVitals,
  ...nextTs,
  {
    files: ['**/*.{js,jsx,mjs,ts,tsx,mts,cts}'],
    rules: {
      // The house convention: a leading underscore marks a binding kept on purpose (a caught error not
      // read, a field left out of a rest copy).
      '@typescript-eslint/no-unused-vars': [
        'warn',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrorsIgnorePattern: '^_', ignoreRestSiblings: true },
      ],
    },
  },
  {
    // Links come from components/link.tsx, which does not prefetch every linked page in view (DEVELOPERS.md).
    files: ['app/**/*.{ts,tsx}', 'components/**/*.{ts,tsx}'],
    ignores: ['components/link.tsx'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          paths: [
            {
              name: 'next/link',
              importNames: ['default'],
              message: "Import Link from '@/components/link' (no background prefetch).",
            },
          ],
        },
      ],
    },
  },
  {
    // Migrations, seeders and sequelize-cli's settings are CommonJS, as sequelize-cli loads them.
    files: ['migrations/**/*.js', 'seeders/**/*.js', '**/*.cjs'],
    languageOptions: { sourceType: 'commonjs' },
    rules: { '@typescript-eslint/no-require-imports': 'off' },
  },
  prettier,
  globalIgnores([
    // eslint-config-next's own ignores, kept because this list replaces them.
    '.next/**',
    'out/**',
    'build/**',
    'next-env.d.ts',
    // Test builds, local data and test output.
    '.next-*/**',
    '.data/**',
    'test-results/**',
  ]),
]);
