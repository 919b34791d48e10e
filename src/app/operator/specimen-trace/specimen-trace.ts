import { DatePipe } from '@angular/common';
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
import type { CutTrace } from '../../../../shared/recipe-types';
import { cutSearchQuery } from '../../../../shared/schemas/operator';
import { CLAMPING_METHOD_LABELS, CUT_MOTION_LABELS, SHAPE_LABELS } from '../../../../shared/vocabulary';
import { controlMessage } from '../../core/forms/control-message';
import { zodValidator } from '../../core/forms/zod-validator';
import { Session } from '../../core/session/session';
import { SignatureList } from '../../ui/signature-list';
import { QuantityPipe } from '../../ui/quantity';
import { CutOutcomeLabel } from '../../ui/cut-outcome-label';
import { CutsApi } from '../../core/api/cuts-api';

type Load = { state: 'idle' } | { state: 'loading' } | { state: 'failed' } | { state: 'ready'; traces: CutTrace[] };

const COOLANT_LABELS = { 'water-soluble': 'Water-soluble coolant', oil: 'Cutting oil', dry: 'Dry (no coolant)' } as const;

/** Specimen trace (design section 9): from a specimen id to the cut, the exact version used, its key parameters and signatures. */
@Component({
  selector: 'kb-specimen-trace',
  imports: [CutOutcomeLabel, DatePipe, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, QuantityPipe, ReactiveFormsModule, RouterLink, SignatureList],
  templateUrl: './specimen-trace.html',
  styleUrl: './specimen-trace.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpecimenTrace {
  private readonly api = inject(CutsApi);
  private readonly router = inject(Router);
  private readonly session = inject(Session);

  /** Query parameter `?specimen=`. */
  readonly specimen = input<string>();

  protected readonly form = inject(NonNullableFormBuilder).group({ specimenId: ['', [zodValidator(cutSearchQuery.shape.specimenId)]] });
  protected readonly field = this.form.controls.specimenId;
  protected readonly load = signal<Load>({ state: 'idle' });
  protected readonly units = computed(() => this.session.user()?.units ?? 'metric');
  protected readonly controlMessage = controlMessage;
  protected readonly motionLabel = CUT_MOTION_LABELS;
  protected readonly clampingLabel = CLAMPING_METHOD_LABELS;
  protected readonly shapeLabel = SHAPE_LABELS;
  protected readonly coolantLabel = COOLANT_LABELS;

  constructor() {
    toObservable(this.specimen)
      .pipe(
        switchMap((raw) => {
          const specimen = (raw ?? '').trim();
          this.field.setValue(specimen);
          if (!specimen) return of<Load>({ state: 'idle' });
          return this.api.trace(specimen).pipe(
            map((traces): Load => ({ state: 'ready', traces })),
            // The error interceptor has said why.
            catchError(() => of<Load>({ state: 'failed' })),
            startWith<Load>({ state: 'loading' }),
          );
        }),
        takeUntilDestroyed(),
      )
      .subscribe((load) => this.load.set(load));
  }

  protected search(): void {
    this.field.markAsTouched();
    if (this.field.invalid) return;
    void this.router.navigate(['/cuts'], { queryParams: { specimen: this.field.value.trim() } });
  }
}
