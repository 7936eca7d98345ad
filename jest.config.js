// Three projects: node (unit + API on PostgreSQL), web components (jsdom), browser end-to-end (Chromium).
// server/scripts/test.sh runs them as separate jest runs (jimp needs --experimental-vm-modules only in node).
const tsJest = ['ts-jest', { tsconfig: '<rootDir>/server/tsconfig.json', diagnostics: { warnOnly: false } }];

module.exports = {
  projects: [
    {
      displayName: 'node',
      testEnvironment: 'node',
      roots: ['<rootDir>/tests/server', '<rootDir>/tests/shared'],
      transform: { '^.+\\.ts$': tsJest },
      moduleFileExtensions: ['ts', 'js', 'json'],
      globalSetup: '<rootDir>/tests/helpers/global-setup.ts',
      setupFilesAfterEnv: ['<rootDir>/tests/helpers/node-timeout.ts'],
    },
    {
      displayName: 'web',
      preset: 'jest-expo/web',
      roots: ['<rootDir>/tests/components'],
      moduleNameMapper: {
        '^react-native$': 'react-native-web',
        '^@/(.*)$': '<rootDir>/$1',
      },
      setupFiles: ['<rootDir>/tests/helpers/jest.setup.web.ts'],
      setupFilesAfterEnv: ['@testing-library/jest-dom'],
      transformIgnorePatterns: [
        '/node_modules/(?!(.pnpm|react-native|@react-native|@react-native-community|expo|@expo|@expo-google-fonts|react-navigation|@react-navigation|standard-navigation|react-native-svg))',
      ],
    },
    {
      displayName: 'e2e',
      testEnvironment: 'node',
      roots: ['<rootDir>/tests/e2e'],
      transform: { '^.+\\.ts$': tsJest },
      moduleFileExtensions: ['ts', 'js', 'json'],
      globalSetup: '<rootDir>/tests/helpers/global-setup.ts',
      setupFilesAfterEnv: ['<rootDir>/tests/helpers/e2e-timeout.ts'],
    },
  ],
};
