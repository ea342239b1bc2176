// @ts-check
import eslint from '@eslint/js';
import tseslint from 'typescript-eslint';
import angular from 'angular-eslint';

/*
 * Library boundaries (docs: DEVELOPERS.md "Layout"). Each library is imported through its entry only:
 * '@seamwright/piecing' and '@seamwright/template-editor' (or their relative 'src/public-api'), and in
 * tests and benchmarks their 'testing' entries. The editor's core is framework-free: no Angular, Konva
 * or RxJS, and nothing from the components around it. ESLint replaces a rule's options when a later
 * block sets it again, so each block below lists every pattern that applies to its files.
 */
const ENTRY_ONLY = "Import the library's entry ('@seamwright/api', '@seamwright/piecing', '@seamwright/template-editor', or their '/testing' in tests and benchmarks), not a path inside it.";
const libraryEntries = [
  { regex: String.raw`(^|/)projects/api/src/(?!public-api$)|^(\.\./)+api/src/(?!public-api$)`, message: ENTRY_ONLY },
  { regex: '^@seamwright/api/', message: ENTRY_ONLY },
  { regex: String.raw`(^|/)piecing/src/(?!(public-api|testing)$)`, message: ENTRY_ONLY },
  { regex: String.raw`(^|/)template-editor/src/(?!(public-api|testing)$)`, message: ENTRY_ONLY },
  { regex: '^@seamwright/(piecing|template-editor)/(?!testing$)', message: ENTRY_ONLY },
];
const noFrameworks = (where) => [
  { regex: '^@angular/', message: `${where} uses no Angular.` },
  { regex: '^konva($|/)', message: `${where} uses no Konva.` },
  { regex: '^rxjs($|/)', message: `${where} uses no RxJS.` },
];
const restrict = (...patterns) => ['error', { patterns: [...libraryEntries, ...patterns] }];
/** Relative paths that climb out of the editor core from a file `depth` folders below it. */
const leavingCore = (depth) => ({
  regex: `^(\\.\\./){${depth + 1}}`,
  message: 'The editor core imports nothing from the components and Konva drawing around it.',
});
const CORE = 'projects/template-editor/src/lib/core';

export default tseslint.config(
  {
    ignores: [
      'dist/**',
      'node_modules/**',
      '.angular/**',
      'data/**',
      'coverage/**',
      'test-results/**',
      'playwright-report/**',
      'e2e/artifacts/**',
      'bench/out/**',
      'docs/**/*.json',
    ],
  },
  {
    files: ['**/*.ts'],
    extends: [eslint.configs.recommended, ...tseslint.configs.recommended],
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      // TypeScript itself reports undefined names; the core rule misreads type-only globals.
      'no-undef': 'off',
    },
  },
  {
    // Tests feed deliberately malformed values to the code under test.
    files: ['**/*.spec.ts', 'tests/**/*.ts'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
  {
    files: ['projects/seamwright/**/*.ts', 'projects/template-editor/**/*.ts'],
    extends: [...angular.configs.tsRecommended],
    processor: angular.processInlineTemplates,
    rules: {
      '@angular-eslint/directive-selector': ['error', { type: 'attribute', prefix: 'sw', style: 'camelCase' }],
      '@angular-eslint/component-selector': ['error', { type: 'element', prefix: 'sw', style: 'kebab-case' }],
    },
  },
  {
    files: ['projects/seamwright/**/*.html', 'projects/template-editor/**/*.html'],
    extends: [...angular.configs.templateRecommended, ...angular.configs.templateAccessibility],
  },
  {
    files: ['**/*.ts'],
    rules: { 'no-restricted-imports': restrict() },
  },
  {
    // The command line sits beside the library's src/ and goes through its entry like everyone else.
    files: ['projects/piecing/cli/**/*.ts'],
    rules: {
      'no-restricted-imports': restrict({ regex: String.raw`^(\.\./)+src/(?!(public-api|testing)$)`, message: ENTRY_ONLY }),
    },
  },
  {
    // Geometry is framework-free and knows nothing of the editor.
    files: ['projects/piecing/src/**/*.ts'],
    rules: {
      'no-restricted-imports': restrict(...noFrameworks('Piecing'), {
        regex: '(^@seamwright/template-editor|(^|/)template-editor/)',
        message: 'Piecing does not depend on the editor.',
      }),
    },
  },
  {
    // The API contract is shared by the server and the app: plain TypeScript and zod, no framework.
    files: ['projects/api/src/**/*.ts'],
    rules: { 'no-restricted-imports': restrict(...noFrameworks('The API contract')) },
  },
  {
    // Components and Konva drawing reach the core through its public API (fixtures: core/testing).
    files: ['projects/template-editor/src/**/*.ts'],
    rules: {
      'no-restricted-imports': restrict({
        regex: String.raw`^\.\.?/(.+/)?core/(?!public-api$|testing/)`,
        message: "Import the editor core through '../core/public-api'.",
      }),
    },
  },
  ...[0, 1, 2].map((depth) => ({
    files: [`${CORE}/${'*/'.repeat(depth)}*.ts`],
    rules: {
      'no-restricted-imports': restrict(...noFrameworks('The editor core'), leavingCore(depth), {
        regex: '^@seamwright/template-editor',
        message: 'The editor core imports nothing from the components and Konva drawing around it.',
      }),
    },
  })),
  {
    // Entries list their names, so what a library offers is read in one place and grows on purpose.
    files: ['**/public-api.ts', 'projects/*/src/testing.ts'],
    rules: {
      'no-restricted-syntax': [
        'error',
        { selector: 'ExportAllDeclaration', message: 'List the exported names; `export *` is not allowed in an entry.' },
      ],
    },
  },
  {
    files: ['**/*.js', '**/*.mjs', '**/*.cjs'],
    extends: [eslint.configs.recommended],
    languageOptions: { globals: { process: 'readonly', console: 'readonly', URL: 'readonly' } },
  },
);
