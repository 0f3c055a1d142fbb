// One jest run for every test: client components (jsdom), units and reference checks (node),
// API tests against the real PostgreSQL and end-to-end tests in Debian's chromium.
const nodeTransform = {
  '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/tsconfig.jest-node.json', isolatedModules: true, diagnostics: false }],
};

module.exports = {
  // A test's time limit is read from the top level, not from a project: each file starts an app or a browser, and on a
  // loaded 2-core machine that passes jest's default 5 s.
  testTimeout: 30_000,
  projects: [
    {
      displayName: 'client',
      preset: 'jest-preset-angular',
      testEnvironment: 'jest-preset-angular/environments/jest-jsdom-env',
      setupFilesAfterEnv: ['<rootDir>/src/setup-jest.ts', '<rootDir>/test/support/browser-storage-for-jsdom.ts'],
      roots: ['<rootDir>/src'],
      testMatch: ['<rootDir>/src/**/*.spec.ts'],
      transform: {
        '^.+\\.(ts|js|mjs|html|svg)$': ['jest-preset-angular', { tsconfig: '<rootDir>/tsconfig.spec.json', stringifyContentPathRegex: '\\.(html|svg)$' }],
      },
      transformIgnorePatterns: ['node_modules/(?!.*\\.mjs$)'],
    },
    {
      displayName: 'unit',
      testEnvironment: 'node',
      roots: ['<rootDir>/shared', '<rootDir>/backend', '<rootDir>/test/reference'],
      testMatch: ['<rootDir>/shared/**/*.spec.ts', '<rootDir>/backend/**/*.spec.ts', '<rootDir>/test/reference/**/*.test.ts'],
      transform: nodeTransform,
    },
    {
      displayName: 'api',
      testEnvironment: 'node',
      roots: ['<rootDir>/test/api'],
      testMatch: ['<rootDir>/test/api/**/*.test.ts'],
      transform: nodeTransform,
    },
    {
      displayName: 'e2e',
      testEnvironment: 'node',
      roots: ['<rootDir>/test/e2e'],
      testMatch: ['<rootDir>/test/e2e/**/*.test.ts'],
      transform: nodeTransform,
    },
  ],
};
