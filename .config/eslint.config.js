// ESLint for the whole repository: TypeScript everywhere, Angular's rules for the client,
// and the import boundaries that keep the layout honest (see DEVELOPERS.md, "Layout").
import js from '@eslint/js';
import angular from 'angular-eslint';
import prettier from 'eslint-config-prettier';
import boundaries from 'eslint-plugin-boundaries';
import tseslint from 'typescript-eslint';

/** What shared/ may never import: it runs in the browser and in Node alike. */
const RUNTIME_ONLY = [
  '@angular/*',
  'rxjs',
  'rxjs/*',
  'express',
  'express-*',
  'knex',
  'mysql2',
  'mysql2/*',
  'node:*',
  'fs',
  'path',
  'crypto',
  'pdfkit',
  'nodemailer',
  'passport',
  'passport-*',
];

export default tseslint.config(
  { ignores: ['dist/**', '.angular/**', '.data/**', 'node_modules/**', 'backups/**', 'test/perf/results/**'] },
  {
    files: ['**/*.ts'],
    extends: [js.configs.recommended, ...tseslint.configs.recommended],
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
      '@typescript-eslint/consistent-type-imports': ['error', { fixStyle: 'inline-type-imports' }],
      // Our regular expressions name control characters on purpose (to strip or refuse them), always as escapes.
      'no-control-regex': 'off',
    },
  },
  {
    // chai's property assertions (`.to.exist`, `.that.is.not.empty`) are expressions by design.
    files: ['test/**/*.ts', 'src/**/*.spec.ts'],
    rules: { '@typescript-eslint/no-unused-expressions': 'off' },
  },
  {
    // shared/ is framework-free: no Angular, no Express, no database, no Node built-ins.
    files: ['shared/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: RUNTIME_ONLY, message: 'shared/ runs in the browser and on the server: keep it free of frameworks and Node.' },
            { group: ['**/server/**', '**/src/**', '**/test/**', '**/seeds/**', '**/migrations/**'], message: 'shared/ imports only shared/.' },
          ],
        },
      ],
    },
  },
  {
    // The client: Angular's own rules, and features that never reach into each other.
    files: ['src/**/*.ts'],
    extends: [...angular.configs.tsRecommended],
    processor: angular.processInlineTemplates,
    plugins: { boundaries },
    settings: {
      'import/resolver': { node: { extensions: ['.ts', '.js'] } },
      'boundaries/include': ['src/**/*.ts', 'shared/**/*.ts'],
      'boundaries/elements': [
        { type: 'core', pattern: 'src/app/core' },
        { type: 'ui', pattern: 'src/app/ui' },
        { type: 'feature', pattern: 'src/app/*', capture: ['feature'] },
        { type: 'testing', pattern: 'src/testing' },
        { type: 'shared', pattern: 'shared' },
      ],
    },
    rules: {
      '@angular-eslint/directive-selector': ['error', { type: 'attribute', prefix: 'kb', style: 'camelCase' }],
      '@angular-eslint/component-selector': ['error', { type: 'element', prefix: 'kb', style: 'kebab-case' }],
      '@angular-eslint/prefer-on-push-component-change-detection': 'error',
      '@angular-eslint/prefer-signals': 'error',
      'boundaries/dependencies': [
        'error',
        {
          default: 'allow',
          policies: [
            {
              from: { element: { type: 'feature' } },
              disallow: { to: { element: { type: 'feature' } } },
              message: 'A feature never imports another feature: move what both need to core/ or ui/.',
            },
            {
              from: { element: { type: 'feature' } },
              allow: { to: { element: { type: 'feature', captured: { feature: '{{ from.captured.feature }}' } } } },
            },
            {
              from: { element: { types: { anyOf: ['core', 'ui', 'shared'] } } },
              disallow: { to: { element: { type: 'feature' } } },
              message: 'core/, ui/ and shared/ never depend on a feature.',
            },
          ],
        },
      ],
    },
  },
  {
    // Test hosts in component specs are throw-away components; OnPush is for the app's own.
    files: ['src/**/*.spec.ts'],
    rules: { '@angular-eslint/prefer-on-push-component-change-detection': 'off' },
  },
  {
    files: ['src/**/*.html'],
    extends: [...angular.configs.templateRecommended, ...angular.configs.templateAccessibility],
    // `x != null` is the one comparison that means "neither null nor undefined" on purpose.
    rules: { '@angular-eslint/template/eqeqeq': ['error', { allowNullOrUndefined: true }] },
  },
  prettier,
);
