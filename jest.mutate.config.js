// The node project's pure tests only (tests/shared, no database): what `npm run mutate` runs against each mutant.
const tsJest = ['ts-jest', { tsconfig: '<rootDir>/server/tsconfig.json', diagnostics: false, isolatedModules: true }];

module.exports = {
  displayName: 'shared',
  testEnvironment: 'node',
  roots: ['<rootDir>/tests/shared'],
  transform: { '^.+\\.ts$': tsJest },
  moduleFileExtensions: ['ts', 'js', 'json'],
};
