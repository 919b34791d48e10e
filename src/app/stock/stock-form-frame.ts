import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { ControlContainer, FormGroupDirective, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { controlMessage } from '../core/forms/control-message';

/**
 * The frame of every stock form dialog: title ("Add a wheel", "Edit Alumina 250"), the form's
 * own error line, the Name field every stock record has (with the field given as
 * `kbBesideName` content beside it), the other fields (given as content), Cancel and the
 * submit button. The dialog puts `[formGroup]` and `(ngSubmit)` on this element; the inner
 * form's submit event bubbles up to them, and the Name field binds to that form group.
 */
@Component({
  selector: 'kb-stock-form-frame',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  template: `
    <h2 mat-dialog-title>{{ editing() ? 'Edit ' + name() : 'Add a ' + noun() }}</h2>
    <form novalidate>
      <mat-dialog-content class="kb-dialog-content">
        @if (error()) {
          <p class="kb-form-error" role="alert" data-testid="form-error">{{ error() }}</p>
        }
        <div class="kb-row">
          <mat-form-field>
            <mat-label>Name</mat-label>
            <input matInput formControlName="name" autocomplete="off" />
            <mat-error data-testid="name-error">{{ nameMessage() }}</mat-error>
          </mat-form-field>
          <ng-content select="[kbBesideName]" />
        </div>
        <ng-content />
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button matButton type="button" mat-dialog-close>Cancel</button>
        <button matButton="filled" type="submit" [disabled]="busy()">{{ editing() ? 'Save changes' : 'Add ' + noun() }}</button>
      </mat-dialog-actions>
    </form>
  `,
  styleUrl: './stock-form.scss',
  // The Name field binds to the dialog's form group, which sits on this very element.
  viewProviders: [{ provide: ControlContainer, useExisting: FormGroupDirective }],
  // As the dialog's own element: the title, content and actions lay out as if they were its children.
  host: { style: 'display: contents' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StockFormFrame {
  private readonly formGroup = inject(FormGroupDirective);

  /** "wheel": the kind of record, in the title and the submit button when adding. */
  readonly noun = input.required<string>();
  /** Editing a record rather than adding one. */
  readonly editing = input(false);
  /** The record's name as typed, in the title when editing. */
  readonly name = input('');
  /** A message that belongs to no field; none when empty. */
  readonly error = input('');
  readonly busy = input(false);

  protected nameMessage(): string {
    return controlMessage(this.formGroup.form.get('name')?.errors);
  }
}
