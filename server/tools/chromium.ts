/**
 * How Kerfbook's tools start Debian's chromium (the browser tests and `bench:web`): the
 * executable (CHROMIUM_PATH, default Debian's /usr/bin/chromium), headless, and with the
 * networking flags — without them chromium floods the closed network with refused
 * connections.
 */
export const CHROMIUM_PATH = process.env['CHROMIUM_PATH'] || '/usr/bin/chromium';

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
