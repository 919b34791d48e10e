/**
 * Zod compiles fast object parsers with `new Function` and probes for that when a schema is
 * built; the CSP (script-src 'self', no 'unsafe-eval') refuses it and the browser reports a
 * violation on every page. Jitless parsing gives the same results without eval. Imported
 * first by main.ts: the probe runs when the first object schema is made.
 */
import { z } from 'zod';

z.config({ jitless: true });
