import { ChangeDetectionStrategy, Component, OnInit, inject } from '@angular/core';

import { Auth } from './core/auth';
import { Shell } from './shell/shell';

/** The root component: the shell, with the session's user asked for once at start. */
@Component({
  selector: 'app-root',
  imports: [Shell],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: '<app-shell />',
  styles: ':host { display: block; height: 100%; }',
})
export class App implements OnInit {
  private readonly auth = inject(Auth);

  /** Starts loading the signed-in user so the toolbar can show the account. */
  ngOnInit(): void {
    void this.auth.ready();
  }
}
