import { defineConfig, globalIgnores } from 'eslint/config';
import nextVitals from 'eslint-config-next/core-web-vitals';
import nextTs from 'eslint-config-next/typescript';

// The framework's recommended rules (React, react-hooks, accessibility, Core Web Vitals) and
// its TypeScript rules, over the whole project.
export default defineConfig([
  ...nextVitals,
  ...nextTs,
  globalIgnores(['.next/**', '.next-*/**', '.data/**', '.tmp/**', 'node_modules/**', 'next-env.d.ts', 'playwright-report/**', 'test-results/**']),
  {
    rules: {
      // `_`-prefixed names mark parameters and bindings kept on purpose.
      // Only tells that the React Compiler would skip a component (TanStack Table, react-hook-form);
      // the project does not use the compiler.
      'react-hooks/incompatible-library': 'off',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
    },
  },
  {
    // Playwright fixtures hand their value on through a parameter named `use`, which is not React's hook.
    files: ['tests/e2e/**'],
    rules: { 'react-hooks/rules-of-hooks': 'off' },
  },
  {
    // CommonJS scripts load their modules with require().
    files: ['**/*.cjs'],
    rules: { '@typescript-eslint/no-require-imports': 'off' },
  },
]);
