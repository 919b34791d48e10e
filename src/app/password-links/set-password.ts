import { ChangeDetectionStrategy, Component } from '@angular/core';

/** Placeholder (issue 6 contract): replaced by the real screen. */
@Component({
  selector: 'kb-set-password',
  template: '<div class="kb-page"><h1 class="kb-page-title">Set your password</h1></div>',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SetPassword {}
