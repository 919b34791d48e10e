import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject, linkedSignal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatMenuModule } from '@angular/material/menu';
import { MatSidenavModule } from '@angular/material/sidenav';
import { MatToolbarModule } from '@angular/material/toolbar';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { map } from 'rxjs';
import { hasAccess } from '@shared/roles';
import { Session } from '../session/session';
import { NAV_ITEMS } from './nav-items';

/** Below this width (phones, tablets up to landscape) the navigation slides over the page instead of sitting beside it. */
const NARROW = '(max-width: 1099.98px)';

/** Frame of every signed-in page: toolbar with the user menu, and the side navigation. */
@Component({
  selector: 'kb-shell',
  imports: [MatButtonModule, MatIconModule, MatListModule, MatMenuModule, MatSidenavModule, MatToolbarModule, RouterLink, RouterLinkActive, RouterOutlet],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Shell {
  private readonly session = inject(Session);
  private readonly router = inject(Router);

  protected readonly user = this.session.user;
  protected readonly navItems = computed(() =>
    NAV_ITEMS.filter((item) => hasAccess(this.session.roles(), item.access) && (!item.devOnly || this.session.devOutbox())),
  );
  protected readonly isNarrow = toSignal(
    inject(BreakpointObserver)
      .observe(NARROW)
      .pipe(map((state) => state.matches)),
    { initialValue: false },
  );
  /** Open beside the page on wide screens, closed (until asked for) on narrow ones. */
  protected readonly navOpen = linkedSignal(() => !this.isNarrow());

  protected toggleNav(): void {
    this.navOpen.update((open) => !open);
  }

  protected closeNavIfOverlaying(): void {
    if (this.isNarrow()) this.navOpen.set(false);
  }

  protected async signOut(): Promise<void> {
    try {
      await this.session.signOut();
    } finally {
      await this.router.navigateByUrl('/sign-in');
    }
  }
}
