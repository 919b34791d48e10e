import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatTabsModule } from '@angular/material/tabs';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';

/** Stock: the lab's materials, wheels, machines and wheel-selection table, one tab each. */
@Component({
  selector: 'kb-stock-page',
  imports: [MatTabsModule, RouterLink, RouterLinkActive, RouterOutlet],
  template: `
    <div class="kb-page">
      <h1 class="kb-page-title">Stock</h1>
      <nav mat-tab-nav-bar [tabPanel]="panel" mat-stretch-tabs="false" mat-align-tabs="start" aria-label="Stock lists">
        @for (tab of tabs; track tab.path) {
          <a mat-tab-link [routerLink]="tab.path" routerLinkActive #active="routerLinkActive" [active]="active.isActive">
            {{ tab.label }}
          </a>
        }
      </nav>
      <mat-tab-nav-panel #panel class="kb-stock-panel">
        <router-outlet />
      </mat-tab-nav-panel>
    </div>
  `,
  styles: `
    .kb-stock-panel {
      display: block;
      padding-top: 16px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StockPage {
  protected readonly tabs = [
    { path: 'materials', label: 'Materials' },
    { path: 'wheels', label: 'Wheels' },
    { path: 'machines', label: 'Machines' },
    { path: 'wheel-selection', label: 'Wheel selection' },
  ];
}
