import type { ComponentType } from '@angular/cdk/portal';
import { Injectable, inject } from '@angular/core';
import { MatDialog } from '@angular/material/dialog';
import { type Observable, firstValueFrom } from 'rxjs';
import { Notifier } from '../core/notifier/notifier';
import { ConfirmDialog, type ConfirmDialogData } from '../ui/confirm-dialog';
import type { DeleteOutcome } from '../core/api/stock-api';

/** What the archive / unarchive / delete actions need from a stock kind. */
export interface ArchivableResource {
  archive(id: number): Observable<unknown>;
  unarchive(id: number): Observable<unknown>;
  delete(id: number): Observable<DeleteOutcome>;
}

type StockRecordRef = { id: number; name: string };

/** The row handlers of one stock table; each reloads the table when the record changed. */
export interface StockRowHandlers<T extends StockRecordRef> {
  archive(record: T): Promise<void>;
  unarchive(record: T): Promise<void>;
  remove(record: T): Promise<void>;
}

/**
 * Archive, unarchive and delete for every stock kind, each behind a confirmation. Resolves
 * true when the record changed (the caller reloads its table). Also opens a kind's form
 * dialog and tells the user what was saved.
 */
@Injectable({ providedIn: 'root' })
export class StockRecordActions {
  private readonly dialog = inject(MatDialog);
  private readonly notifier = inject(Notifier);

  /** Archive, unarchive and delete bound to one table's resource, noun and reload. */
  rowHandlers<T extends StockRecordRef>(resource: ArchivableResource, noun: string, changed: () => void): StockRowHandlers<T> {
    return {
      archive: async (record) => {
        if (await this.archive(resource, record, noun)) changed();
      },
      unarchive: async (record) => {
        if (await this.unarchive(resource, record, noun)) changed();
      },
      remove: async (record) => {
        if (await this.delete(resource, record, noun)) changed();
      },
    };
  }

  /** Opens a stock kind's add or edit dialog; when it closes with the saved record, says so and calls `saved`. */
  openForm<D>(component: ComponentType<unknown>, data: D, options: { width: string; editing: boolean }, saved: () => void): void {
    this.dialog
      .open<unknown, D, { name: string }>(component, { data, width: options.width, maxWidth: '95vw' })
      .afterClosed()
      .subscribe((record) => {
        if (!record) return;
        void this.notifier.show(options.editing ? `Changes to ${record.name} were saved.` : `${record.name} was added.`, 'OK', 5000);
        saved();
      });
  }

  async archive(resource: ArchivableResource, record: { id: number; name: string }, noun: string): Promise<boolean> {
    const confirmed = await this.confirm({
      title: `Archive ${record.name}?`,
      message: [`The ${noun} stays readable in every recipe that uses it, but is no longer offered for new recipes.`, 'You can unarchive it at any time.'],
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
      message: [`If no recipe uses this ${noun}, it is deleted for good.`, 'If a recipe uses it, Kerfbook keeps it for that recipe and archives it instead.'],
      confirmLabel: 'Delete',
    });
    if (!confirmed) return false;
    try {
      const outcome = await firstValueFrom(resource.delete(record.id));
      void this.notifier.show(
        outcome.archived ? `${record.name} is used by a recipe, so it was archived instead of deleted.` : `${record.name} was deleted.`,
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
