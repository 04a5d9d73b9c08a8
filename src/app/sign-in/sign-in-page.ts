import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';

import { apiErrorMessage, apiFieldErrors } from '../core/api-error';
import { Auth } from '../core/auth';

/** The e-mail addresses of the demo accounts (their password is in the README, never on screen). */
export const DEMO_ACCOUNTS = ['admin@demo.test', 'lead@demo.test', 'machinist@demo.test', 'apprentice@demo.test'] as const;

/** The sign-in form: e-mail and password, the server's refusal shown inline, then back to `next`. */
@Component({
  selector: 'app-sign-in-page',
  imports: [
    ReactiveFormsModule, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule,
    MatProgressBarModule, RouterLink,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './sign-in-page.html',
  styleUrl: './sign-in-page.scss',
})
export default class SignInPage {
  private readonly auth = inject(Auth);
  private readonly router = inject(Router);

  /** Where to go after signing in, from the `?next=` query parameter. */
  readonly next = input<string | undefined>();

  /** The form's controls and their rules. */
  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email, Validators.maxLength(254)]],
    password: ['', [Validators.required, Validators.maxLength(200)]],
  });
  /** Whether a sign-in request is on its way. */
  protected readonly pending = signal(false);
  /** The server's message when it refused the sign-in. */
  protected readonly serverError = signal<string | null>(null);
  /** Whether the password is shown in clear. */
  protected readonly showPassword = signal(false);
  /** The demo accounts' e-mail addresses, as one line of text. */
  protected readonly demoAccounts = DEMO_ACCOUNTS.join(', ');

  /** Sends the form to the server; on success goes to `next` (or home). */
  protected async signIn(): Promise<void> {
    if (this.pending()) return;
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.pending.set(true);
    this.serverError.set(null);
    const { email, password } = this.form.getRawValue();
    try {
      await this.auth.signIn(email.trim(), password);
    } catch (err: unknown) {
      this.showRefusal(err);
      return;
    } finally {
      this.pending.set(false);
    }
    await this.router.navigateByUrl(safeNextUrl(this.next()));
  }

  /** Shows or hides the password. */
  protected togglePassword(): void {
    this.showPassword.update(shown => !shown);
  }

  private showRefusal(err: unknown): void {
    this.serverError.set(apiErrorMessage(err));
    const fields = apiFieldErrors(err);
    for (const name of ['email', 'password'] as const) {
      const message = fields[name];
      if (message) this.form.controls[name].setErrors({ server: message });
    }
  }
}

/** A same-site path to go to after signing in; anything else (another origin, sign-in itself) means home. */
export function safeNextUrl(next: string | null | undefined): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return '/';
  if (next.startsWith('/sign-in')) return '/';
  return next;
}
