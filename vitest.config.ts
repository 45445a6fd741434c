import { defineConfig } from 'vitest/config';

// Every test runs on the default engine ('auto': native when it loads); the learn and attribute
// tests run a second time on the portable tfjs engine (SURMISE_ENGINE=tfjs).
export default defineConfig({
  test: {
    testTimeout: 120_000,
    hookTimeout: 120_000,
    pool: 'forks',
    projects: [
      { extends: true, test: { name: 'default', include: ['tests/**/*.test.ts'] } },
      { extends: true, test: { name: 'tfjs', include: ['tests/learn/**/*.test.ts', 'tests/attribute/**/*.test.ts'], env: { SURMISE_ENGINE: 'tfjs' } } },
    ],
  },
});
