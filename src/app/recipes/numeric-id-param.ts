import type { CanMatchFn } from '@angular/router';

/** Matches `recipes/:id` only when the id is a whole number, leaving words such as `new` to other routes. */
export const numericIdParam: CanMatchFn = (_route, segments) => /^[1-9]\d*$/.test(segments[1]?.path ?? '');
