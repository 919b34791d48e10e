import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { rxResource, takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import type { CutTrace } from '@shared/recipe-types';
import { cutSearchQuery } from '@shared/schemas/operator';
import { CLAMPING_METHOD_LABELS, COOLANT_TYPE_LABELS, CUT_MOTION_LABELS, SHAPE_LABELS } from '@shared/vocabulary';
import { controlMessage } from '../../core/forms/control-message';
import { zodValidator } from '../../core/forms/zod-validator';
import { Session } from '../../core/session/session';
import { SignatureList } from '../../ui/signature-list';
import { QuantityPipe } from '../../ui/quantity';
import { CutOutcomeLabel } from '../../ui/cut-outcome-label';
import { CutsApi } from '../../core/api/cuts-api';
import { LabDatePipe } from '../../core/dates/lab-date-pipe';

type Load = { state: 'idle' } | { state: 'loading' } | { state: 'failed' } | { state: 'ready'; traces: CutTrace[] };

/** Specimen trace: from a specimen id to the cut, the exact version used, its key parameters and signatures. */
@Component({
  selector: 'kb-specimen-trace',
  imports: [
    CutOutcomeLabel,
    LabDatePipe,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    QuantityPipe,
    ReactiveFormsModule,
    RouterLink,
    SignatureList,
  ],
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
  private readonly traces = rxResource({
    params: () => (this.specimen() ?? '').trim() || undefined,
    stream: ({ params }) => this.api.trace(params),
  });
  protected readonly load = computed<Load>(() => {
    const traces = this.traces;
    if (traces.status() === 'idle') return { state: 'idle' };
    // The error interceptor has said why it failed.
    if (traces.error()) return { state: 'failed' };
    return traces.hasValue() && !traces.isLoading() ? { state: 'ready', traces: traces.value() } : { state: 'loading' };
  });
  protected readonly units = computed(() => this.session.user()?.units ?? 'metric');
  protected readonly controlMessage = controlMessage;
  protected readonly motionLabel = CUT_MOTION_LABELS;
  protected readonly clampingLabel = CLAMPING_METHOD_LABELS;
  protected readonly shapeLabel = SHAPE_LABELS;
  protected readonly coolantLabel = COOLANT_TYPE_LABELS;

  constructor() {
    // The specimen in the URL shows in the field (on arrival, back and forward).
    toObservable(this.specimen)
      .pipe(takeUntilDestroyed())
      .subscribe((raw) => this.field.setValue((raw ?? '').trim()));
  }

  protected search(): void {
    this.field.markAsTouched();
    if (this.field.invalid) return;
    void this.router.navigate(['/cuts'], { queryParams: { specimen: this.field.value.trim() } });
  }
}
