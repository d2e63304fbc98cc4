/** Two projects: the server side (unit, API and browser tests under test/) and the Angular specs beside the components. */
const swc = [
  '@swc/jest',
  { jsc: { parser: { syntax: 'typescript', decorators: true }, target: 'es2022' }, module: { type: 'commonjs' } },
];

module.exports = {
  maxWorkers: 2,
  projects: [
    {
      displayName: 'server',
      testEnvironment: 'node',
      testMatch: ['<rootDir>/test/**/*.test.ts', '<rootDir>/server/**/*.test.ts'],
      transform: { '^.+\\.(t|j|mj)s$': swc },
      // marked and feed ship only ES modules.
      transformIgnorePatterns: ['/node_modules/(?!(marked|feed)/)'],
      setupFilesAfterEnv: ['<rootDir>/test/helpers/jest-timeouts.ts'],
      // Unit tests of the app's pure builders reach the shared modules through the app's own `@contracts` imports.
      moduleNameMapper: { '^@contracts/(.*)$': '<rootDir>/contracts/$1' },
    },
    {
      displayName: 'client',
      preset: 'jest-preset-angular',
      testEnvironment: 'jsdom',
      testMatch: ['<rootDir>/src/**/*.spec.ts'],
      setupFilesAfterEnv: ['<rootDir>/src/test-setup.ts'],
      // The shared label and date modules, as tsconfig.json's `paths` maps them for the app.
      moduleNameMapper: { '^@contracts/(.*)$': '<rootDir>/contracts/$1' },
    },
  ],
};
