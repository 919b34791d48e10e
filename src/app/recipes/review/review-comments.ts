import { ChangeDetectionStrategy, Component, computed, inject, input, output, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { catchError, firstValueFrom, of, switchMap } from 'rxjs';
import type { ReviewCommentDto } from '@shared/recipe-types';
import { requiredText } from '@shared/schemas/numbers';
import { controlMessage } from '../../core/forms/control-message';
import { applyServerErrors } from '../../core/forms/server-errors';
import { zodValidator } from '../../core/forms/zod-validator';
import { isApiError } from '../../core/http/api-error';
import { callerHandles } from '../../core/http/caller-handles';
import { WorkflowApi } from '../../core/api/workflow-api';
import { LabDatePipe } from '../../core/dates/lab-date-pipe';

/** The review comments of one version, oldest first, with a box to add one when `canAdd`. */
@Component({
  selector: 'kb-review-comments',
  imports: [LabDatePipe, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, ReactiveFormsModule],
  templateUrl: './review-comments.html',
  styleUrl: './review-comments.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewComments {
  private readonly api = inject(WorkflowApi);
  private readonly fb = inject(NonNullableFormBuilder);

  readonly recipeId = input.required<number>();
  readonly version = input.required<number>();
  readonly canAdd = input(false);
  /** Emits the comments whenever they are loaded or one is added. */
  readonly loaded = output<readonly ReviewCommentDto[]>();

  protected readonly comments = signal<ReviewCommentDto[] | null>(null);
  protected readonly busy = signal(false);
  protected readonly formError = signal('');
  protected readonly controlMessage = controlMessage;
  protected readonly form = this.fb.group({ body: ['', [Validators.required, zodValidator(requiredText('Comment', 4000))]] });

  private readonly target = computed(() => ({ recipeId: this.recipeId(), version: this.version() }));

  constructor() {
    toObservable(this.target)
      .pipe(
        switchMap(({ recipeId, version }) => {
          this.comments.set(null);
          // Shown by the error interceptor; the page still works without its comments.
          return this.api.comments(recipeId, version).pipe(catchError(() => of<ReviewCommentDto[]>([])));
        }),
        takeUntilDestroyed(),
      )
      .subscribe((comments) => {
        this.comments.set(comments);
        this.loaded.emit(comments);
      });
  }

  protected async addComment(): Promise<void> {
    this.formError.set('');
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    try {
      const added = await firstValueFrom(
        this.api.addComment(this.recipeId(), this.version(), { body: this.form.getRawValue().body, path: '' }, callerHandles(400)),
      );
      const next = [...(this.comments() ?? []), added];
      this.comments.set(next);
      this.loaded.emit(next);
      this.form.reset();
    } catch (e) {
      if (!isApiError(e)) throw e;
      this.formError.set(applyServerErrors(this.form, e.errors).join(' '));
    } finally {
      this.busy.set(false);
    }
  }
}
