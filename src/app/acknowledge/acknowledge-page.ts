import { ChangeDetectionStrategy, Component } from '@angular/core';

/** Placeholder (issue 6 contract): replaced by the real screen. */
@Component({
  selector: 'kb-acknowledge-page',
  template: '<div class="kb-page"><h1 class="kb-page-title">Acknowledge</h1></div>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AcknowledgePage {}
