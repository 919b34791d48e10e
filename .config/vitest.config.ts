import { defineConfig } from 'vitest/config';

// The builder runs every spec file in one environment (no isolation between files), so a test
// that times out leaves its TestBed behind and every file after it fails. On a loaded
// two-core machine a first render can take a few seconds: give each test room.
export default defineConfig({
  test: {
    testTimeout: 20_000,
    hookTimeout: 20_000,
  },
});
