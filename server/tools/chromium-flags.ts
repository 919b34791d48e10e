/**
 * How Kerfbook's tools start Debian's chromium (the browser tests and `bench:web`): headless
 * and, per toolchain pitfall 18, with the networking flags — without them chromium floods
 * the closed network with refused connections.
 */
export const CHROMIUM_FLAGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-dev-shm-usage',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
];
