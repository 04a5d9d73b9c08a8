import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import { Auth } from '../core/auth';
import { AREAS } from '../shell/areas';

/** The landing page: what Slantwise is for, one card per area, and the shop-safety caution. */
@Component({
  selector: 'app-home-page',
  imports: [RouterLink, MatCardModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './home-page.html',
  styleUrl: './home-page.scss',
})
export default class HomePage {
  protected readonly auth = inject(Auth);
  /** Every area, as cards. */
  protected readonly areas = AREAS;
}
