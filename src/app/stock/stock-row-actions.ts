import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';

/** The actions menu on one row of a stock table: edit, archive or unarchive, delete. */
@Component({
  selector: 'kb-stock-row-actions',
  imports: [MatButtonModule, MatIconModule, MatMenuModule],
  template: `
    <button matIconButton type="button" [matMenuTriggerFor]="menu" [attr.aria-label]="'Actions for ' + record().name">
      <mat-icon>more_vert</mat-icon>
    </button>
    <mat-menu #menu="matMenu" xPosition="before">
      <ng-template matMenuContent>
        <button mat-menu-item type="button" (click)="edit.emit()">
          <mat-icon>edit</mat-icon>
          <span>Edit</span>
        </button>
        @if (record().archived) {
          <button mat-menu-item type="button" (click)="unarchive.emit()">
            <mat-icon>unarchive</mat-icon>
            <span>Unarchive</span>
          </button>
        } @else {
          <button mat-menu-item type="button" (click)="archive.emit()">
            <mat-icon>archive</mat-icon>
            <span>Archive</span>
          </button>
        }
        <button mat-menu-item type="button" (click)="delete.emit()">
          <mat-icon>delete</mat-icon>
          <span>Delete (or archive if a recipe uses it)</span>
        </button>
      </ng-template>
    </mat-menu>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StockRowActions {
  readonly record = input.required<{ name: string; archived: boolean }>();
  readonly edit = output<void>();
  readonly archive = output<void>();
  readonly unarchive = output<void>();
  /** The server archives instead when a recipe uses the record. */
  readonly delete = output<void>();
}
