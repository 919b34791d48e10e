import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import type { CheckCodeResult } from '@shared/recipe-types';
import { checkCodeParam } from '@shared/schemas/operator';
import { RECIPE_STATUS_MARKS, SHEET_VERDICT_TONES } from '@shared/status-colours';
import { CHECK_CODE_PLACE } from '@shared/vocabulary';
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
  current: { icon: RECIPE_STATUS_MARKS.approved.icon, headline: 'Current — this sheet may be used', usable: true },
  pending: { icon: 'schedule', headline: 'Approved, not yet in force — do not use it yet', usable: false },
  superseded: { icon: RECIPE_STATUS_MARKS.superseded.icon, headline: 'Superseded — do not use this sheet', usable: false },
  withdrawn: { icon: RECIPE_STATUS_MARKS.withdrawn.icon, headline: 'Withdrawn — do not use this sheet', usable: false },
};

/** "7KQ2M9XD" → "7KQ2-M9XD", as printed. */
export function printedCode(code: string): string {
  return code.length === 8 ? `${code.slice(0, 4)}-${code.slice(4)}` : code;
}

/**
 * Check a sheet: the code printed on a bench sheet, typed or scanned from
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
  protected readonly verdictTones = SHEET_VERDICT_TONES;

  /** Route parameter `:code`; absent on /check. */
  readonly code = input<string>();

  /** The code from the URL, if it has the printed form. */
  private readonly parsed = computed(() => {
    const raw = this.code();
    if (!raw) return { state: 'none' } as const;
    const parsed = checkCodeParam.safeParse(raw);
    return parsed.success ? ({ state: 'code', code: parsed.data } as const) : ({ state: 'malformed' } as const);
  });
  // Unknown and malformed codes get their own message on this page, not a snack bar.
  private readonly result = rxResource({
    params: () => {
      const parsed = this.parsed();
      return parsed.state === 'code' ? parsed.code : undefined;
    },
    stream: ({ params }) => this.api.check(params, callerHandles(400, 404)),
  });
  protected readonly verdict = computed<Verdict>(() => {
    const parsed = this.parsed();
    if (parsed.state !== 'code') return parsed;
    if (this.result.isLoading()) return { state: 'loading' };
    const error = this.result.error();
    if (isApiError(error) && error.status === 404) return { state: 'unknown', code: printedCode(parsed.code) };
    if (isApiError(error) && error.status === 400) return { state: 'malformed' };
    if (error) return { state: 'failed' };
    return this.result.hasValue() ? { state: 'ready', result: this.result.value() } : { state: 'loading' };
  });
  protected readonly info = computed(() => {
    const v = this.verdict();
    return v.state === 'ready' ? CHECK_STATE_INFO[v.result.state] : null;
  });
  /** Where the code is printed on the sheet, for the hints. */
  protected readonly codePlace = CHECK_CODE_PLACE;

  protected readonly form = inject(NonNullableFormBuilder).group({ code: ['', [zodValidator(checkCodeParam)]] });
  protected readonly codeField = this.form.controls.code;
  protected readonly controlMessage = controlMessage;
  protected readonly printedCode = printedCode;

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
