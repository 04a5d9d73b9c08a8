import { ChangeDetectionStrategy, Component, effect, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';

import { apiErrorMessage, apiFieldErrors } from '../core/api-error';
import { newPasswordValidator } from './new-password';
import { TeamApi } from './team-api';

/**
 * Password reset. Without a token: ask for a link by e-mail (the answer never says whether the
 * address has an account). With `?token=` from the e-mail: choose a new password.
 */
@Component({
  selector: 'sw-reset-password-page',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="page access">
      <mat-card appearance="outlined" class="access-card">
        <mat-card-header><mat-card-title><h1>{{ token() ? 'Choose a new password' : 'Forgot your password?' }}</h1></mat-card-title></mat-card-header>
        <mat-card-content>
          @if (message()) {
            <p role="status">{{ message() }}</p>
            <a mat-flat-button routerLink="/sign-in"><mat-icon>login</mat-icon> Back to sign-in</a>
          } @else if (!token()) {
            <p>Enter the e-mail of your account. If it belongs to an active account, a link to choose a new password is sent to it.</p>
            <form [formGroup]="requestForm" (ngSubmit)="request()" novalidate>
              <mat-form-field appearance="outline">
                <mat-label>E-mail</mat-label>
                <input matInput type="email" formControlName="email" autocomplete="username">
                @if (requestForm.controls.email.invalid) { <mat-error>Enter an e-mail address like name&#64;example.com.</mat-error> }
              </mat-form-field>
              @if (error()) { <p class="error" role="alert">{{ error() }}</p> }
              <button mat-flat-button type="submit" [disabled]="pending()"><mat-icon>mail</mat-icon> Send me a link</button>
            </form>
          } @else if (linkOk()) {
            <form [formGroup]="passwordForm" (ngSubmit)="complete()" novalidate>
              <mat-form-field appearance="outline">
                <mat-label>New password</mat-label>
                <input matInput type="password" formControlName="password" autocomplete="new-password">
                <mat-hint>At least 10 characters, at most 200. Saving it signs you out everywhere.</mat-hint>
                @if (passwordForm.controls.password.getError('newPassword'); as e) { <mat-error>{{ e }}</mat-error> }
              </mat-form-field>
              @if (error()) { <p class="error" role="alert">{{ error() }}</p> }
              <button mat-flat-button type="submit" [disabled]="pending()"><mat-icon>lock_reset</mat-icon> Save the new password</button>
            </form>
          } @else if (error()) {
            <p class="error" role="alert">{{ error() }}</p>
            <a mat-button routerLink="/reset-password">Ask for a new link</a>
          } @else {
            <p>Checking the link…</p>
          }
        </mat-card-content>
      </mat-card>
    </section>
  `,
  styleUrl: './access-page.scss',
})
export default class ResetPasswordPage {
  private readonly api = inject(TeamApi);
  private readonly fb = inject(NonNullableFormBuilder);

  /** The reset token, from `?token=`; absent on the request form. */
  readonly token = input<string>();

  protected readonly message = signal<string | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly pending = signal(false);
  protected readonly linkOk = signal(false);
  protected readonly requestForm = this.fb.group({ email: ['', [Validators.required, Validators.email, Validators.maxLength(254)]] });
  protected readonly passwordForm = this.fb.group({ password: ['', [newPasswordValidator]] });

  constructor() {
    effect(() => void this.check(this.token()));
  }

  /** Asks for a reset link. */
  protected async request(): Promise<void> {
    if (this.requestForm.invalid) {
      this.requestForm.markAllAsTouched();
      return;
    }
    await this.run(async () => {
      const res = await firstValueFrom(this.api.requestReset(this.requestForm.getRawValue().email.trim()));
      this.message.set(res.message);
    });
  }

  /** Saves the new password. */
  protected async complete(): Promise<void> {
    if (this.passwordForm.invalid) {
      this.passwordForm.markAllAsTouched();
      return;
    }
    await this.run(async () => {
      await firstValueFrom(this.api.completeReset(this.token() ?? '', this.passwordForm.getRawValue().password));
      this.message.set('Your password is changed. Sign in with the new one.');
    });
  }

  private async run(work: () => Promise<void>): Promise<void> {
    this.pending.set(true);
    this.error.set(null);
    try {
      await work();
    } catch (err) {
      this.error.set(apiFieldErrors(err)['password'] ?? apiErrorMessage(err));
    } finally {
      this.pending.set(false);
    }
  }

  private async check(token: string | undefined): Promise<void> {
    if (!token) return;
    try {
      await firstValueFrom(this.api.checkReset(token));
      this.linkOk.set(true);
    } catch (err) {
      this.error.set(apiErrorMessage(err));
    }
  }
}
