import type { CanDeactivateFn } from '@angular/router';

/** A page that may hold input not yet saved. */
export interface LeavesSafely {
  /** True to leave; may ask the person first. */
  canLeave(): boolean | Promise<boolean>;
}

/** Asks the page before the router takes the person away from unsaved input. */
export const unsavedChangesGuard: CanDeactivateFn<LeavesSafely> = (page) => page.canLeave();
