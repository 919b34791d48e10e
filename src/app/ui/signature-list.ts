import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { SignatureDto } from '@shared/recipe-types';
import { SIGNATURE_MEANING_INFO } from './signature-meaning';
import { LabDatePipe } from '../core/dates/lab-date-pipe';

/**
 * The electronic signatures of one version, each with printed name, UTC date and time, meaning,
 * comment and the content hash it is bound to (21 CFR 11.50, 11.70). Shown wherever a version is.
 */
@Component({
  selector: 'kb-signature-list',
  imports: [LabDatePipe, MatIconModule],
  template: `
    @if (signatures().length) {
      <ul class="kb-signatures" aria-label="Electronic signatures">
        @for (s of signatures(); track s.id) {
          <li class="kb-signature" [attr.data-meaning]="s.meaning">
            <mat-icon aria-hidden="true">{{ meaning[s.meaning].icon }}</mat-icon>
            <div>
              <p class="kb-sig-line">
                <strong class="kb-sig-meaning">{{ meaning[s.meaning].label }}</strong>
                by <span class="kb-sig-name">{{ s.signerName }}</span> on
                <time class="kb-sig-time" [attr.datetime]="s.signedAt">{{ s.signedAt | labDate: 'time' }}</time>
              </p>
              <p class="kb-sig-detail">
                Meaning: {{ meaning[s.meaning].label }} — {{ meaning[s.meaning].statement }}. Signed content
                <code [title]="s.contentHash">{{ s.contentHash.slice(0, 12) }}…</code>
              </p>
              @if (s.comment) {
                <p class="kb-sig-comment">“{{ s.comment }}”</p>
              }
            </div>
          </li>
        }
      </ul>
    } @else if (emptyText()) {
      <p class="kb-sig-none">{{ emptyText() }}</p>
    }
  `,
  styles: `
    .kb-signatures {
      list-style: none;
      margin: 0;
      padding: 0;
      display: grid;
      gap: 6px;
    }
    .kb-signature {
      display: flex;
      gap: 10px;
      align-items: flex-start;
      padding: 8px 12px;
      border-left: 4px solid var(--mat-sys-primary);
      background: var(--mat-sys-surface-container-low);
      border-radius: var(--mat-sys-corner-small);
    }
    .kb-signature[data-meaning='withdrawn'] {
      border-left-color: var(--mat-sys-error);
    }
    mat-icon {
      flex: none;
      color: var(--mat-sys-primary);
    }
    [data-meaning='withdrawn'] mat-icon {
      color: var(--mat-sys-error);
    }
    p {
      margin: 0;
    }
    .kb-sig-line {
      font: var(--mat-sys-body-medium);
    }
    .kb-sig-detail,
    .kb-sig-none {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .kb-sig-comment {
      font: var(--mat-sys-body-medium);
      font-style: italic;
      margin-top: 2px;
    }
    code {
      font-family: 'Roboto Mono', ui-monospace, monospace;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignatureList {
  readonly signatures = input.required<readonly SignatureDto[]>();
  /** Said when there is no signature; nothing is shown when empty. */
  readonly emptyText = input('');

  protected readonly meaning = SIGNATURE_MEANING_INFO;
}
