import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { Router } from '@angular/router';

import { Auth, AuthUser, ROLE_LABELS } from '../core/auth';

/** The toolbar's account button: name and role, with a menu to sign out. */
@Component({
  selector: 'app-account-menu',
  imports: [MatButtonModule, MatIconModule, MatMenuModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <button mat-button class="account-button" type="button" [matMenuTriggerFor]="accountMenu">
      <mat-icon aria-hidden="true">account_circle</mat-icon>
      <span class="cdk-visually-hidden">Account menu of</span>
      <span class="account-name">{{ user().name }}</span>
      <span class="role-badge">{{ roleLabel() }}</span>
    </button>
    <mat-menu #accountMenu="matMenu" xPosition="before">
      <div class="account-card">
        <div class="account-card-name">{{ user().name }}</div>
        <div class="account-card-email">{{ user().email }}</div>
        <div class="account-card-role">Role: {{ roleLabel() }}</div>
      </div>
      <button mat-menu-item type="button" class="sign-out" (click)="signOut()">
        <mat-icon>logout</mat-icon>
        <span>Sign out</span>
      </button>
    </mat-menu>
  `,
  styleUrl: './account-menu.scss',
})
export class AccountMenu {
  private readonly auth = inject(Auth);
  private readonly router = inject(Router);

  /** The signed-in user. */
  readonly user = input.required<AuthUser>();
  /** The user's role as a label. */
  protected readonly roleLabel = computed(() => ROLE_LABELS[this.user().role]);

  /** Signs out and goes home; a failure was already shown by the error snack bar. */
  protected async signOut(): Promise<void> {
    try {
      await this.auth.signOut();
    } catch {
      return;
    }
    await this.router.navigateByUrl('/');
  }
}
