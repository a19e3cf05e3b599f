/** Two projects: fast unit tests beside the code, and e2e tests against the real MariaDB. */
const swc = ['@swc/jest', JSON.parse(require('fs').readFileSync(__dirname + '/.swcrc', 'utf8'))];
module.exports = {
  // Applies to every project; e2e tests talk to MariaDB and the SMTP fake.
  testTimeout: 60000,
  projects: [
    {
      displayName: 'unit',
      testEnvironment: 'node',
      rootDir: __dirname,
      testMatch: ['<rootDir>/src/**/*.spec.ts', '<rootDir>/fakes/**/*.spec.ts'],
      transform: { '^.+\\.ts$': swc },
    },
    {
      displayName: 'e2e',
      testEnvironment: 'node',
      rootDir: __dirname,
      testMatch: ['<rootDir>/test/**/*.e2e-spec.ts'],
      transform: { '^.+\\.ts$': swc },
    },
  ],
};
