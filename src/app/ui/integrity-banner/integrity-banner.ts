import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { VersionIntegrityDto } from '@shared/recipe-types';

/**
 * A version whose stored content no longer matches what was submitted and signed: a
 * full-width alarm with what does not match. The server has refused its sheet and told
 * admins and auditors; nobody should cut with it or approve it.
 */
@Component({
  selector: 'kb-integrity-banner',
  imports: [MatIconModule],
  template: `
    @let i = integrity();
    @if (i && !i.ok) {
      <div class="kb-integrity" role="alert" data-testid="integrity-failed">
        <mat-icon aria-hidden="true">gpp_bad</mat-icon>
        <p>
          <strong>{{ label() }} fails its integrity check — do not use it.</strong>
          <span class="kb-sub">Its content no longer matches what was signed. Its bench sheet does not print; admins and auditors have been told.</span>
          @for (problem of i.problems; track $index) {
            <span class="kb-sub kb-problem">{{ problem }}</span>
          }
        </p>
      </div>
    }
  `,
  styleUrl: './integrity-banner.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class IntegrityBanner {
  readonly integrity = input<VersionIntegrityDto | undefined>();
  /** How the banner names the version, e.g. "Version 2". */
  readonly label = input('This version');
}
