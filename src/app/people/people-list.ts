import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatChipsModule } from '@angular/material/chips';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatMenuModule } from '@angular/material/menu';
import { MatSelectModule } from '@angular/material/select';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { catchError, firstValueFrom, map, of } from 'rxjs';
import type { UserDto } from '@shared/api-types';
import type { MachineRecord } from '@shared/stock-types';
import { ROLES, ROLE_INFO, type Role } from '@shared/roles';
import { USER_SORT_FIELDS, type UserListQuery } from '@shared/schemas/users';
import { Notifier } from '../core/notifier/notifier';
import { Session } from '../core/session/session';
import { StockApi } from '../core/api/stock-api';
import { ConfirmDialog, type ConfirmDialogData } from '../ui/confirm-dialog';
import { PagedList } from '../ui/paged-list';
import { PagedTable } from '../ui/paged-table';
import { PeopleApi } from '../core/api/people-api';
import { PersonFormDialog, type PersonFormDialogData } from './person-form-dialog';
import { TemporaryPasswordDialog, type TemporaryPasswordDialogData } from './temporary-password-dialog';
import { LabDatePipe } from '../core/dates/lab-date-pipe';

type StatusFilter = UserListQuery['status'];

/** Admin: the lab's people, sorted, filtered and paged by the server. */
@Component({
  selector: 'kb-people-list',
  imports: [
    LabDatePipe,
    MatButtonModule,
    MatChipsModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatMenuModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
    PagedTable,
    ReactiveFormsModule,
  ],
  templateUrl: './people-list.html',
  styleUrl: './people-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PeopleList {
  private readonly api = inject(PeopleApi);
  private readonly dialog = inject(MatDialog);
  private readonly notifier = inject(Notifier);
  private readonly session = inject(Session);
  private readonly fb = inject(NonNullableFormBuilder);

  protected readonly columns = ['username', 'displayName', 'email', 'roles', 'machines', 'status', 'lastSignInAt', 'actions'];
  protected readonly roleOptions = ROLES.map((role) => ({ role, label: ROLE_INFO[role].label }));
  protected readonly roleLabel = (role: Role) => ROLE_INFO[role].label;
  protected readonly roleFilter = this.fb.control<Role | ''>('');
  protected readonly statusFilter = this.fb.control<StatusFilter>('active');
  private readonly role = toSignal(this.roleFilter.valueChanges, { initialValue: this.roleFilter.value });
  private readonly status = toSignal(this.statusFilter.valueChanges, { initialValue: this.statusFilter.value });
  protected readonly list = new PagedList<UserDto, Pick<UserListQuery, 'role' | 'status'>, UserListQuery['sort']>({
    load: (query) => this.api.list(query),
    filters: () => ({ role: this.role() || undefined, status: this.status() }),
    sortable: USER_SORT_FIELDS,
    defaultSort: 'username',
  });
  protected readonly currentUserId = computed(() => this.session.user()?.id);
  protected readonly inactive = (person: UserDto) => !person.active;

  /** Every machine, archived ones too: an operator may still be assigned to a retired saw. */
  private readonly machines = toSignal(
    inject(StockApi)
      .machines.list({ archived: 'all', pageSize: 200, sort: 'name' })
      .pipe(
        map((page) => page.items),
        catchError(() => of([] as MachineRecord[])),
      ),
    { initialValue: [] as MachineRecord[] },
  );
  private readonly machineNames = computed(() => new Map(this.machines().map((m) => [m.id, m.name])));
  /** "Bench saw B2, Floor saw F1" for an operator's row. */
  /** The operator's machines by name, one per line in the table. */
  protected readonly machineNamesOf = (person: UserDto): string[] => person.machineIds.map((id) => this.machineNames().get(id) ?? `Machine ${id}`);

  protected addPerson(): void {
    this.dialog
      .open<PersonFormDialog, PersonFormDialogData, UserDto>(PersonFormDialog, {
        data: { machines: this.machines() },
        width: '600px',
        maxWidth: '95vw',
      })
      .afterClosed()
      .subscribe((person) => {
        if (!person) return;
        void this.notifier.show(`${person.displayName} was added. Hand over the temporary password; it must be changed at the first sign-in.`, 'OK', 8000);
        this.reload();
      });
  }

  protected invitePerson(): void {
    this.dialog
      .open<PersonFormDialog, PersonFormDialogData, UserDto>(PersonFormDialog, {
        data: { invite: true, machines: this.machines() },
        width: '600px',
        maxWidth: '95vw',
      })
      .afterClosed()
      .subscribe((person) => {
        if (!person) return;
        void this.notifier.show(`An invitation was sent to ${person.email}. ${person.displayName} has 72 hours to choose a password.`, 'OK', 8000);
        this.reload();
      });
  }

  protected async resendInvitation(person: UserDto): Promise<void> {
    try {
      const { message } = await firstValueFrom(this.api.resendInvitation(person.id));
      void this.notifier.show(message || `A new invitation was sent to ${person.displayName}.`, 'OK', 8000);
      this.reload();
    } catch {
      // Shown by the error interceptor (409 when the person has already set a password).
    }
  }

  protected editPerson(person: UserDto): void {
    this.dialog
      .open<PersonFormDialog, PersonFormDialogData, UserDto>(PersonFormDialog, {
        data: { person, machines: this.machines() },
        width: '600px',
        maxWidth: '95vw',
      })
      .afterClosed()
      .subscribe((saved) => {
        if (!saved) return;
        void this.notifier.show(`Changes to ${saved.displayName} were saved.`, 'OK', 5000);
        this.reload();
      });
  }

  protected setTemporaryPassword(person: UserDto): void {
    this.dialog
      .open<TemporaryPasswordDialog, TemporaryPasswordDialogData, UserDto>(TemporaryPasswordDialog, {
        data: { person },
        width: '520px',
        maxWidth: '95vw',
      })
      .afterClosed()
      .subscribe((saved) => {
        if (!saved) return;
        void this.notifier.show(`${saved.displayName} must change the temporary password at the next sign-in.`, 'OK', 8000);
        this.reload();
      });
  }

  protected async deactivate(person: UserDto): Promise<void> {
    const confirmed = await this.confirm({
      title: `Deactivate ${person.displayName}?`,
      message: [
        `${person.displayName} (${person.username}) will no longer be able to sign in.`,
        'Their history is kept: the drafts, signatures, cut records and trail entries with their name stay as they are.',
        'You can reactivate the account at any time.',
      ],
      confirmLabel: 'Deactivate',
    });
    if (!confirmed) return;
    await this.runAction(() => this.api.deactivate(person.id), `${person.displayName} was deactivated.`);
  }

  protected async reactivate(person: UserDto): Promise<void> {
    const confirmed = await this.confirm({
      title: `Reactivate ${person.displayName}?`,
      message: [
        `${person.displayName} (${person.username}) will be able to sign in again with their roles as they are now.`,
        'Their history was kept while the account was inactive.',
      ],
      confirmLabel: 'Reactivate',
    });
    if (!confirmed) return;
    await this.runAction(() => this.api.reactivate(person.id), `${person.displayName} was reactivated.`);
  }

  private async confirm(data: ConfirmDialogData): Promise<boolean> {
    const ref = this.dialog.open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, { data, maxWidth: '95vw', width: '480px' });
    return (await firstValueFrom(ref.afterClosed())) === true;
  }

  private async runAction(action: () => ReturnType<PeopleApi['deactivate']>, done: string): Promise<void> {
    try {
      await firstValueFrom(action());
      void this.notifier.show(done, 'OK', 5000);
      this.reload();
    } catch {
      // Shown by the error interceptor.
    }
  }

  private reload(): void {
    this.list.reload();
  }
}
