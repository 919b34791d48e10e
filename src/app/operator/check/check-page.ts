import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { catchError, map, of, startWith, switchMap } from 'rxjs';
import type { CheckCodeResult } from '../../../../shared/recipe-types';
import { checkCodeParam } from '../../../../shared/schemas/operator';
import { controlMessage } from '../../core/forms/control-message';
import { zodValidator } from '../../core/forms/zod-validator';
import { isApiError } from '../../core/http/api-error';
import { callerHandles } from '../../core/http/caller-handles';
import { CheckApi } from './check-api';

type Verdict =
  | { state: 'none' }
  | { state: 'loading' }
  | { state: 'malformed' }
  | { state: 'unknown'; code: string }
  | { state: 'failed' }
  | { state: 'ready'; result: CheckCodeResult };

/** How each state of a printed version reads at the saw: icon and words, never colour alone. */
export const CHECK_STATE_INFO: Record<CheckCodeResult['state'], { icon: string; headline: string; usable: boolean }> = {
  current: { icon: 'verified', headline: 'Current — this sheet may be used', usable: true },
  pending: { icon: 'schedule', headline: 'Approved, not yet in force — do not use it yet', usable: false },
  superseded: { icon: 'history', headline: 'Superseded — do not use this sheet', usable: false },
  withdrawn: { icon: 'block', headline: 'Withdrawn — do not use this sheet', usable: false },
};

/** "7KQ2M9XD" → "7KQ2-M9XD", as printed. */
export function printedCode(code: string): string {
  return code.length === 8 ? `${code.slice(0, 4)}-${code.slice(4)}` : code;
}

/**
 * Check a sheet (design section 7): the code printed on a bench sheet, typed or scanned from
 * its QR code, says whether that version is still the one to use.
 */
@Component({
  selector: 'kb-check-page',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, ReactiveFormsModule, RouterLink],
  templateUrl: './check-page.html',
  styleUrl: './check-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CheckPage {
  private readonly api = inject(CheckApi);
  private readonly router = inject(Router);

  /** Route parameter `:code`; absent on /check. */
  readonly code = input<string>();

  protected readonly verdict = signal<Verdict>({ state: 'none' });
  protected readonly info = computed(() => {
    const v = this.verdict();
    return v.state === 'ready' ? CHECK_STATE_INFO[v.result.state] : null;
  });
  protected readonly form = inject(NonNullableFormBuilder).group({ code: ['', [zodValidator(checkCodeParam)]] });
  protected readonly codeField = this.form.controls.code;
  protected readonly controlMessage = controlMessage;
  protected readonly printedCode = printedCode;

  constructor() {
    toObservable(this.code)
      .pipe(
        switchMap((raw) => {
          if (!raw) return of<Verdict>({ state: 'none' });
          const parsed = checkCodeParam.safeParse(raw);
          if (!parsed.success) return of<Verdict>({ state: 'malformed' });
          // Unknown and malformed codes get their own message on this page, not a snack bar.
          return this.api.check(parsed.data, callerHandles(400, 404)).pipe(
            map((result): Verdict => ({ state: 'ready', result })),
            catchError((e: unknown) => {
              if (isApiError(e) && e.status === 404) return of<Verdict>({ state: 'unknown', code: printedCode(parsed.data) });
              if (isApiError(e) && e.status === 400) return of<Verdict>({ state: 'malformed' });
              return of<Verdict>({ state: 'failed' });
            }),
            startWith<Verdict>({ state: 'loading' }),
          );
        }),
        takeUntilDestroyed(),
      )
      .subscribe((verdict) => this.verdict.set(verdict));
  }

  protected checkTyped(): void {
    this.codeField.markAsTouched();
    const parsed = checkCodeParam.safeParse(this.codeField.value);
    if (!parsed.success) {
      this.codeField.updateValueAndValidity();
      return;
    }
    this.codeField.reset();
    void this.router.navigate(['/check', printedCode(parsed.data)]);
  }
}
