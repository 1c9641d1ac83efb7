import { createDefaultEsmPreset } from 'ts-jest';
import { testKinds } from './test/support/test-kinds.js';

const root = new URL('.', import.meta.url).pathname;
const { unit, integration } = testKinds(root);
const paths = (files) => files.map((f) => `<rootDir>/${f}`);

const common = {
  ...createDefaultEsmPreset({ tsconfig: 'tsconfig.test.json' }),
  testEnvironment: 'node',
  roots: ['<rootDir>/test'],
  moduleNameMapper: { '^(\\.{1,2}/.*)\\.js$': '$1' },
  cacheDirectory: '<rootDir>/node_modules/.cache/jest',
  // The IR checker runs after building every program (test/support/ir-check-hook.ts).
  setupFilesAfterEnv: ['<rootDir>/test/support/ir-check-hook.ts'],
};

export default {
  maxWorkers: 2,
  projects: [
    // No compiler, browser or CLI process; jest's default timeouts (test/support/test-kinds.js).
    { ...common, displayName: 'unit', testMatch: paths(unit) },
    // Compilers, Chromium, valgrind, the CLI, and slow in-process planning: a 10-minute timeout.
    { ...common, displayName: 'integration', testMatch: paths(integration), setupFilesAfterEnv: [...common.setupFilesAfterEnv, '<rootDir>/test/support/integration-timeout.ts'] },
  ],
};
