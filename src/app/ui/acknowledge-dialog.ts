import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, type MatDialog, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import type { MyAcknowledgementDto } from '@shared/recipe-types';
import { isApiError } from '../core/http/api-error';
import { callerHandles } from '../core/http/caller-handles';
import { benchSheetUrl, openInNewTab } from '../core/api/bench-sheet';
import { AcknowledgeApi } from '../core/api/acknowledge-api';
import { acknowledgeStatement } from './acknowledgement-state';

/** The version whose sheet the operator asked for. */
export interface AcknowledgeDialogData {
  recipeId: number;
  number: string;
  title: string;
  version: number;
}

/**
 * The print gate: an operator who has not yet acknowledged a new version of their machine's
 * recipe is asked to do so before the sheet opens. "Acknowledge and print" records the
 * acknowledgement, then opens the sheet; the dialog closes with the acknowledgement.
 */
@Component({
  selector: 'kb-acknowledge-dialog',
  imports: [MatButtonModule, MatDialogModule, MatIconModule, RouterLink],
  template: `
    <h2 mat-dialog-title>Acknowledge before printing</h2>
    <mat-dialog-content class="kb-ack-dialog">
      @if (blockedTab()) {
        <p role="status">
          Acknowledged. Your browser did not open the sheet by itself:
          <a [href]="sheetUrl" target="_blank" rel="noopener" data-testid="sheet-link" (click)="close()">open the bench sheet</a>.
        </p>
      } @else {
        <p>
          <strong class="kb-mono">{{ data.number }}</strong> version {{ data.version }} — {{ data.title }} is new for your machine. Read it before you use it;
          the sheet opens once you have acknowledged it.
        </p>
        <p class="kb-statement" data-testid="ack-statement">{{ statement }}</p>
        @if (refusal()) {
          <p class="kb-form-error" role="alert" data-testid="ack-refusal">{{ refusal() }}</p>
        }
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      @if (blockedTab()) {
        <button matButton type="button" class="kb-touch" (click)="close()">Close</button>
      } @else {
        <a
          matButton
          class="kb-touch"
          [routerLink]="['/recipes', data.recipeId, 'acknowledge']"
          [queryParams]="{ v: data.version }"
          (click)="cancel()"
          data-testid="read-first"
        >
          Read it first
        </a>
        <button matButton type="button" class="kb-touch" (click)="cancel()">Cancel</button>
        <button matButton="filled" type="button" class="kb-touch" [disabled]="busy()" (click)="acknowledgeAndPrint()" cdkFocusInitial>
          <mat-icon>task_alt</mat-icon>
          Acknowledge and print
        </button>
      }
    </mat-dialog-actions>
  `,
  styles: `
    .kb-ack-dialog {
      max-width: 560px;
    }
    .kb-mono {
      font-family: 'Roboto Mono', ui-monospace, monospace;
    }
    .kb-statement {
      margin: 12px 0 0;
      padding: 12px 16px;
      border-left: 4px solid var(--mat-sys-primary);
      background: var(--mat-sys-surface-container-low);
      border-radius: var(--mat-sys-corner-small);
      font: var(--mat-sys-title-medium);
    }
    .kb-touch {
      min-height: 48px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AcknowledgeDialog {
  private readonly api = inject(AcknowledgeApi);
  private readonly ref = inject<MatDialogRef<AcknowledgeDialog, MyAcknowledgementDto>>(MatDialogRef);
  protected readonly data = inject<AcknowledgeDialogData>(MAT_DIALOG_DATA);

  protected readonly statement = acknowledgeStatement(this.data.number, this.data.version);
  protected readonly sheetUrl = benchSheetUrl(this.data.recipeId, this.data.version);
  protected readonly busy = signal(false);
  /** The server's reason when it refuses (409): not an approved version of the operator's machine. */
  protected readonly refusal = signal('');
  protected readonly blockedTab = signal(false);
  private acknowledged: MyAcknowledgementDto | undefined;

  protected async acknowledgeAndPrint(): Promise<void> {
    this.refusal.set('');
    this.busy.set(true);
    try {
      this.acknowledged = await firstValueFrom(this.api.acknowledge(this.data.recipeId, this.data.version, callerHandles(409)));
    } catch (e) {
      // Anything but a refusal has been shown by the error interceptor.
      if (isApiError(e) && e.status === 409) this.refusal.set(e.generalMessage);
      return;
    } finally {
      this.busy.set(false);
    }
    if (openInNewTab(this.sheetUrl)) this.close();
    else this.blockedTab.set(true);
  }

  protected cancel(): void {
    this.ref.close();
  }

  protected close(): void {
    this.ref.close(this.acknowledged);
  }
}

/** Opens the print gate; resolves with the acknowledgement once recorded (the sheet is then open), undefined when cancelled. */
export function askToAcknowledge(dialog: MatDialog, data: AcknowledgeDialogData): Promise<MyAcknowledgementDto | undefined> {
  return firstValueFrom(
    dialog
      .open<AcknowledgeDialog, AcknowledgeDialogData, MyAcknowledgementDto>(AcknowledgeDialog, {
        data,
        width: '600px',
        maxWidth: '95vw',
      })
      .afterClosed(),
  );
}
