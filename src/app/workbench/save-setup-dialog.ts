import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';

import type { SetupKind } from '../../../shared/api/setup';
import { apiErrorMessage, apiFieldErrors } from '../core/api-error';
import { type SavedSetup, SetupsApi } from './setups-api';

/** What the save dialog is opened with. */
export interface SaveSetupData {
  /** The area of the set-up. */
  readonly kind: SetupKind;
  /** The page's form values. */
  readonly inputs: Readonly<Record<string, unknown>>;
  /** A name to start from. */
  readonly suggestedName: string;
}

/** Asks for the set-up's name, job and notes, then saves it; closes with the saved set-up. */
@Component({
  selector: 'sw-save-setup-dialog',
  imports: [ReactiveFormsModule, MatDialogModule, MatFormFieldModule, MatInput, MatButton],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 mat-dialog-title>Save as set-up</h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate>
      <mat-dialog-content class="fields">
        <mat-form-field appearance="outline">
          <mat-label>Set-up name</mat-label>
          <input matInput formControlName="name" required maxlength="160" cdkFocusInitial>
          @if (form.controls.name.hasError('server')) {
            <mat-error>{{ form.controls.name.getError('server') }}</mat-error>
          } @else {
            <mat-error>Give the set-up a name.</mat-error>
          }
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Job (optional)</mat-label>
          <input matInput formControlName="job" maxlength="80">
          @if (form.controls.job.hasError('server')) {
            <mat-error>{{ form.controls.job.getError('server') }}</mat-error>
          }
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Notes (optional)</mat-label>
          <textarea matInput formControlName="notes" rows="3" maxlength="10000"></textarea>
        </mat-form-field>
        @if (problem(); as message) {
          <p class="problem" role="alert">{{ message }}</p>
        }
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" [disabled]="pending()">Save set-up</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .fields { display: grid; gap: 4px; min-width: min(420px, 80vw); padding-top: 8px !important; }
    .problem { color: var(--mat-sys-error); margin: 0; }
  `,
})
export class SaveSetupDialog {
  private readonly data = inject<SaveSetupData>(MAT_DIALOG_DATA);
  private readonly dialogRef = inject<MatDialogRef<SaveSetupDialog, SavedSetup>>(MatDialogRef);
  private readonly setups = inject(SetupsApi);

  /** Name, job and notes. */
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: [this.data.suggestedName, [Validators.required, Validators.maxLength(160)]],
    job: ['', Validators.maxLength(80)],
    notes: ['', Validators.maxLength(10_000)],
  });
  /** Whether the save is on its way. */
  protected readonly pending = signal(false);
  /** The server's refusal, if any. */
  protected readonly problem = signal<string | null>(null);

  /** Sends the set-up to the server and closes with it. */
  protected save(): void {
    if (this.form.invalid || this.pending()) {
      this.form.markAllAsTouched();
      return;
    }
    const { name, job, notes } = this.form.getRawValue();
    this.pending.set(true);
    this.problem.set(null);
    this.setups
      .create({ name: name.trim(), kind: this.data.kind, inputs: { ...this.data.inputs }, notes, job: job.trim() || null })
      .subscribe({
        next: (setup) => this.dialogRef.close(setup),
        error: (err: unknown) => {
          this.pending.set(false);
          this.problem.set(apiErrorMessage(err));
          const fields = apiFieldErrors(err);
          for (const key of ['name', 'job'] as const) {
            if (fields[key]) this.form.controls[key].setErrors({ server: fields[key] });
          }
        },
      });
  }
}
