// Lint for correctness, not layout (layout is Prettier's). typescript-eslint's recommended set
// for TypeScript, eslint-plugin-svelte's for components; the layer arrows are checked by
// tests/architecture, and types by `npm run typecheck`.
import js from '@eslint/js';
import svelte from 'eslint-plugin-svelte';
import globals from 'globals';
import ts from 'typescript-eslint';

export default ts.config(
  { ignores: ['node_modules/', 'dist-main/', 'dist-renderer/', 'release/', '.tsbuild/', 'tests/artifacts/', 'test-results/', 'playwright-report/', '.dev/'] },
  js.configs.recommended,
  ...ts.configs.recommended,
  ...svelte.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node } },
    rules: {
      // A name starting with _ is deliberately unused (a parameter a signature requires).
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
      // Import checks look for control characters on purpose (NUL bytes, escape sequences).
      'no-control-regex': 'off',
      // `{' '}` keeps a space between inline elements that a line break would otherwise eat.
      'svelte/no-useless-mustaches': 'off',
      // State classes hold plain Map and Set values they replace whole (the assignment is the
      // update), and lookups that never drive the page.
      'svelte/prefer-svelte-reactivity': 'off',
    },
  },
  {
    files: ['src-renderer/**'],
    languageOptions: { globals: { ...globals.browser } },
  },
  {
    // Playwright fixtures take their dependencies as a destructured first argument, none as `{}`.
    files: ['tests/e2e/**'],
    rules: { 'no-empty-pattern': 'off' },
  },
  {
    files: ['**/*.svelte', '**/*.svelte.ts'],
    languageOptions: { parserOptions: { parser: ts.parser, extraFileExtensions: ['.svelte'] } },
  },
);
