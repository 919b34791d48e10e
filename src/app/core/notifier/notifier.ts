import { Injectable, Injector, inject } from '@angular/core';

/**
 * Shows short messages to the user in a snack bar. The snack bar (and the CDK overlay it
 * needs) is loaded on first use, so the sign-in page does not pay for it up front.
 */
@Injectable({ providedIn: 'root' })
export class Notifier {
  private readonly injector = inject(Injector);

  async show(message: string, action = 'Dismiss', durationMs = 8000): Promise<void> {
    const { MatSnackBar } = await import('@angular/material/snack-bar');
    this.injector.get(MatSnackBar).open(message, action, { duration: durationMs });
  }
}
