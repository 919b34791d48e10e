import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { ROLE_INFO } from '../../../shared/roles';
import { Session } from '../core/session/session';

/** Home page: who you are here and what you may do. Per-role work lists come later. */
@Component({
  selector: 'kb-today',
  imports: [MatIconModule],
  templateUrl: './today.html',
  styleUrl: './today.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Today {
  private readonly session = inject(Session);

  protected readonly displayName = computed(() => this.session.user()?.displayName ?? '');
  protected readonly roles = computed(() => this.session.roles().map((role) => ({ role, ...ROLE_INFO[role] })));
}
