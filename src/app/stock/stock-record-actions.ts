import { Injectable, inject } from '@angular/core';
import { MatDialog } from '@angular/material/dialog';
import { type Observable, firstValueFrom } from 'rxjs';
import { Notifier } from '../core/notifier/notifier';
import { ConfirmDialog, type ConfirmDialogData } from '../ui/confirm-dialog';
import type { DeleteOutcome } from './stock-api';

/** What the archive / unarchive / delete actions need from a stock kind. */
export interface ArchivableResource {
  archive(id: number): Observable<unknown>;
  unarchive(id: number): Observable<unknown>;
  delete(id: number): Observable<DeleteOutcome>;
}

/**
 * Archive, unarchive and delete for every stock kind, each behind a confirmation. Resolves
 * true when the record changed (the caller reloads its table).
 */
@Injectable({ providedIn: 'root' })
export class StockRecordActions {
  private readonly dialog = inject(MatDialog);
  private readonly notifier = inject(Notifier);

  async archive(resource: ArchivableResource, record: { id: number; name: string }, noun: string): Promise<boolean> {
    const confirmed = await this.confirm({
      title: `Archive ${record.name}?`,
      message: [
        `The ${noun} stays readable in every recipe that uses it, but is no longer offered for new recipes.`,
        'You can unarchive it at any time.',
      ],
      confirmLabel: 'Archive',
    });
    if (!confirmed) return false;
    return this.run(resource.archive(record.id), `${record.name} was archived.`);
  }

  async unarchive(resource: ArchivableResource, record: { id: number; name: string }, noun: string): Promise<boolean> {
    return this.run(resource.unarchive(record.id), `${record.name} is offered for new recipes again (${noun} unarchived).`);
  }

  /** The server archives instead of deleting when a recipe uses the record; the message says which happened. */
  async delete(resource: ArchivableResource, record: { id: number; name: string }, noun: string): Promise<boolean> {
    const confirmed = await this.confirm({
      title: `Delete ${record.name}?`,
      message: [
        `If no recipe uses this ${noun}, it is deleted for good.`,
        'If a recipe uses it, Kerfbook keeps it for that recipe and archives it instead.',
      ],
      confirmLabel: 'Delete',
    });
    if (!confirmed) return false;
    try {
      const outcome = await firstValueFrom(resource.delete(record.id));
      void this.notifier.show(
        outcome.archived
          ? `${record.name} is used by a recipe, so it was archived instead of deleted.`
          : `${record.name} was deleted.`,
        'OK',
        8000,
      );
      return true;
    } catch {
      // Shown by the error interceptor.
      return false;
    }
  }

  private async confirm(data: ConfirmDialogData): Promise<boolean> {
    const ref = this.dialog.open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, { data, maxWidth: '95vw', width: '480px' });
    return (await firstValueFrom(ref.afterClosed())) === true;
  }

  private async run(action: Observable<unknown>, done: string): Promise<boolean> {
    try {
      await firstValueFrom(action);
      void this.notifier.show(done, 'OK', 5000);
      return true;
    } catch {
      return false;
    }
  }
}
