// One lint setup for the whole project: typescript-eslint everywhere, angular-eslint's recommended rules for the app.
// `npm run lint` fails on any error or warning; `npm run lint -- --fix` repairs what can be repaired.
import eslint from '@eslint/js';
import tseslint from 'typescript-eslint';
import angular from 'angular-eslint';
import prettier from 'eslint-config-prettier';
import jsdoc from 'eslint-plugin-jsdoc';
import globals from 'globals';

export default tseslint.config(
  // Landed migrations are never edited, so they are not linted either; build output is not ours.
  { ignores: ['dist/**', '.angular/**', 'node_modules/**', 'migrations/**', 'coverage/**'] },
  {
    files: ['**/*.ts'],
    extends: [eslint.configs.recommended, ...tseslint.configs.recommended],
    rules: {
      // An unused argument named with a leading underscore is deliberate (Express's four-argument error handler).
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  {
    files: ['**/*.mjs', '**/*.js'],
    extends: [eslint.configs.recommended],
    languageOptions: { globals: { ...globals.node } },
  },
  {
    files: ['src/**/*.ts'],
    extends: [...angular.configs.tsRecommended],
    processor: angular.processInlineTemplates,
    rules: {
      '@angular-eslint/component-selector': ['error', { type: 'element', prefix: 'ps', style: 'kebab-case' }],
      '@angular-eslint/directive-selector': ['error', { type: 'attribute', prefix: 'ps', style: 'camelCase' }],
    },
  },
  {
    files: ['src/**/*.html'],
    extends: [...angular.configs.templateRecommended, ...angular.configs.templateAccessibility],
  },
  {
    // Every public method of a service, repository or client API says in one sentence what it does and why.
    files: ['server/**/*-service.ts', 'server/**/*-repository.ts', 'src/app/**/*-api.ts', 'src/app/**/*-store.ts'],
    plugins: { jsdoc },
    rules: {
      'jsdoc/require-jsdoc': [
        'error',
        { publicOnly: true, checkConstructors: false, require: { FunctionDeclaration: true, MethodDefinition: true } },
      ],
    },
  },
  prettier,
);
