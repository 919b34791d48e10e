import { ChangeDetectionStrategy, Component } from '@angular/core';

/** Placeholder (issue 6 contract): replaced by the real screen. */
@Component({
  selector: 'kb-outbox',
  template: '<div class="kb-page"><h1 class="kb-page-title">Outbox</h1></div>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Outbox {}
