import { ChangeDetectionStrategy, Component, effect, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';

import type { InvitationPreviewDto } from '../../../shared/api/team-admin';
import { apiErrorMessage, apiFieldErrors } from '../core/api-error';
import { ROLE_LABELS } from '../core/auth';
import { newPasswordValidator } from './new-password';
import { TeamApi } from './team-api';

/** The page an invitation e-mail links to: choose a name and password to join the team. */
@Component({
  selector: 'sw-accept-invite-page',
  imports: [ReactiveFormsModule, RouterLink, MatCardModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="page access">
      <mat-card appearance="outlined" class="access-card">
        <mat-card-header><mat-card-title><h1>Join the team</h1></mat-card-title></mat-card-header>
        <mat-card-content>
          @if (preview(); as p) {
            <p>You are invited to <strong>{{ p.teamName }}</strong> as <strong>{{ roleLabels[p.role] }}</strong>, with the e-mail {{ p.email }}.</p>
            <form [formGroup]="form" (ngSubmit)="accept()" novalidate>
              <mat-form-field appearance="outline">
                <mat-label>Your name</mat-label>
                <input matInput formControlName="name" autocomplete="name">
                @if (form.controls.name.hasError('required')) { <mat-error>Enter your name.</mat-error> }
                @if (form.controls.name.hasError('maxlength')) { <mat-error>Keep the name under 120 characters.</mat-error> }
                @if (form.controls.name.hasError('server')) { <mat-error>{{ form.controls.name.getError('server') }}</mat-error> }
              </mat-form-field>
              <mat-form-field appearance="outline">
                <mat-label>New password</mat-label>
                <input matInput type="password" formControlName="password" autocomplete="new-password">
                <mat-hint>At least 10 characters, at most 200.</mat-hint>
                @if (form.controls.password.getError('newPassword'); as e) { <mat-error>{{ e }}</mat-error> }
                @if (form.controls.password.hasError('server')) { <mat-error>{{ form.controls.password.getError('server') }}</mat-error> }
              </mat-form-field>
              @if (error()) { <p class="error" role="alert">{{ error() }}</p> }
              <button mat-flat-button type="submit" [disabled]="pending()"><mat-icon>how_to_reg</mat-icon> Create my account</button>
            </form>
          } @else if (done()) {
            <p role="status">Your account is ready. Sign in with your e-mail and the password you chose.</p>
            <a mat-flat-button routerLink="/sign-in"><mat-icon>login</mat-icon> Sign in</a>
          } @else if (error()) {
            <p class="error" role="alert">{{ error() }}</p>
            <a mat-button routerLink="/sign-in">Go to sign-in</a>
          } @else {
            <p>Checking the invitation…</p>
          }
        </mat-card-content>
      </mat-card>
    </section>
  `,
  styleUrl: './access-page.scss',
})
export default class AcceptInvitePage {
  private readonly api = inject(TeamApi);

  /** The invitation token, from `?token=`. */
  readonly token = input<string>();

  protected readonly roleLabels = ROLE_LABELS;
  protected readonly preview = signal<InvitationPreviewDto | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly pending = signal(false);
  protected readonly done = signal(false);
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', [Validators.required, Validators.maxLength(120)]],
    password: ['', [newPasswordValidator]],
  });

  constructor() {
    effect(() => void this.check(this.token()));
  }

  /** Creates the account; on success shows the way to sign in. */
  protected async accept(): Promise<void> {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.pending.set(true);
    this.error.set(null);
    const { name, password } = this.form.getRawValue();
    try {
      await firstValueFrom(this.api.acceptInvitation(this.token() ?? '', name.trim(), password));
      this.preview.set(null);
      this.done.set(true);
    } catch (err) {
      const fields = apiFieldErrors(err);
      for (const key of ['name', 'password'] as const) if (fields[key]) this.form.controls[key].setErrors({ server: fields[key] });
      this.error.set(apiErrorMessage(err));
    } finally {
      this.pending.set(false);
    }
  }

  private async check(token: string | undefined): Promise<void> {
    if (!token) {
      this.error.set('This page needs the link from your invitation e-mail.');
      return;
    }
    try {
      this.preview.set(await firstValueFrom(this.api.previewInvitation(token)));
    } catch (err) {
      this.error.set(apiErrorMessage(err));
    }
  }
}
