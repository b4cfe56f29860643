// @ts-check
// Lint for the whole tree, with the layer rules of DEVELOPERS.md ("The house") as errors:
// shared/ stands on nothing of ours, data-import/ on shared/ alone, server/database/ knows no
// feature, the client reaches the server only through HTTP.
import eslint from '@eslint/js';
import angular from 'angular-eslint';
import globals from 'globals';
import tseslint from 'typescript-eslint';

/** Import patterns a folder may not use, with the reason the lint message gives. */
const forbiddenImports = {
  shared: [
    { group: ['**/server/**', '**/server'], message: 'shared/ is the bottom layer: it may not import the server.' },
    { group: ['**/src/**', '**/app/**'], message: 'shared/ is the bottom layer: it may not import the client.' },
    { group: ['**/data-import/**'], message: 'shared/ is the bottom layer: it may not import data-import/.' },
    { group: ['node:*'], message: 'shared/ runs unchanged in the browser: no Node-only modules.' },
  ],
  dataImport: [
    {
      group: ['**/server/**', '**/server'],
      message: 'data-import/ is pure (read, check, plan, write CSV): no server.',
    },
    { group: ['**/src/**'], message: 'data-import/ may not import the client.' },
    { group: ['sequelize', 'mariadb', 'express'], message: 'data-import/ is pure: no database, no web server.' },
  ],
  database: [
    {
      group: ['../accounts/**', '../catalog/**', '../selection/**', '../calculations/**', '../projects/**'],
      message: 'server/database/ is storage: it knows no feature (vocabularies come from shared/).',
    },
    {
      group: ['../../accounts/**', '../../catalog/**', '../../selection/**', '../../calculations/**'],
      message: 'server/database/ is storage: it knows no feature (vocabularies come from shared/).',
    },
    {
      group: ['../../projects/**', '../../launch/**', '../launch/**', '**/data-import/**'],
      message: 'server/database/ knows no feature.',
    },
  ],
  client: [
    { group: ['**/server/**'], message: 'The client reaches the server through the API, never by import.' },
    { group: ['**/data-import/**'], message: 'The client may not import data-import/.' },
  ],
};

const restrict = (patterns) => ({ 'no-restricted-imports': ['error', { patterns }] });

export default tseslint.config(
  {
    ignores: ['dist/**', 'var/**', '.angular/**', 'node_modules/**', 'shared/api/openapi-types.ts', 'test-results/**'],
  },
  {
    files: ['**/*.ts'],
    extends: [eslint.configs.recommended, ...tseslint.configs.recommended],
    languageOptions: { globals: { ...globals.node } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  {
    files: ['**/*.mjs'],
    extends: [eslint.configs.recommended],
    languageOptions: { globals: { ...globals.node } },
  },
  {
    files: ['src/**/*.ts'],
    extends: [...angular.configs.tsRecommended],
    processor: angular.processInlineTemplates,
    languageOptions: { globals: { ...globals.browser } },
    rules: {
      ...restrict(forbiddenImports.client),
      // The style guide (v20+) names files and classes without Component/Page suffix rules.
      '@angular-eslint/component-class-suffix': 'off',
      '@angular-eslint/directive-class-suffix': 'off',
      '@angular-eslint/component-selector': ['error', { type: 'element', prefix: 'rf', style: 'kebab-case' }],
      '@angular-eslint/directive-selector': ['error', { type: 'attribute', prefix: 'rf', style: 'camelCase' }],
    },
  },
  {
    files: ['src/**/*.html'],
    extends: [...angular.configs.templateRecommended, ...angular.configs.templateAccessibility],
  },
  { files: ['shared/**/*.ts'], rules: restrict(forbiddenImports.shared) },
  { files: ['data-import/**/*.ts'], rules: restrict(forbiddenImports.dataImport) },
  { files: ['server/database/**/*.ts'], rules: restrict(forbiddenImports.database) },
  {
    files: ['test/**/*.ts', 'src/**/*.spec.ts'],
    rules: { '@typescript-eslint/no-unused-expressions': 'off' },
  },
);
