/**
 * Zod compiles fast object parsers with `new Function` and probes for that when a schema is
 * built; the CSP (script-src 'self', no 'unsafe-eval') refuses it and the browser reports a
 * violation on every page. Jitless parsing gives the same results without eval. Imported
 * first by main.ts: the probe runs when the first object schema is made.
 *
 * Set through the global zod reads its configuration from (`globalThis.__zod_globalConfig`,
 * which `z.config()` writes too) rather than by importing zod here: an import would pull
 * the whole validation library into the first script every screen loads.
 */
const holder = globalThis as typeof globalThis & { __zod_globalConfig?: Record<string, unknown> };
// The same object zod keeps, whether or not zod has loaded yet.
holder.__zod_globalConfig ??= {};
holder.__zod_globalConfig['jitless'] = true;

export {};
