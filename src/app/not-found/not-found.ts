import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { RouterLink } from '@angular/router';

@Component({
  selector: 'kb-not-found',
  imports: [MatButtonModule, RouterLink],
  template: `
    <main class="kb-page kb-message-page">
      <h1 class="kb-page-title">Page not found</h1>
      <p>There is no page at this address in Kerfbook. It may have moved, or the link is mistyped.</p>
      <a matButton="filled" routerLink="/today">Go to Today</a>
    </main>
  `,
  styles: `
    .kb-message-page {
      max-width: 640px;
      padding-top: 64px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotFound {}
