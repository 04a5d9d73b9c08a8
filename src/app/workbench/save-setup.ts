import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router } from '@angular/router';

import type { SetupKind } from '../../../shared/api/setup';
import { Auth } from '../core/auth';
import { type SaveSetupData, SaveSetupDialog } from './save-setup-dialog';
import { SETUP_PARAM } from './query-state';
import type { SavedSetup } from './setups-api';

/** How long the "saved" snack bar stays, in milliseconds. */
const SAVED_NOTICE_MS = 10_000;

/**
 * "Save as set-up" for a signed-in user: asks for a name, job and notes, saves the page's inputs
 * (POST /api/setups) and offers a link that reopens the set-up. Hidden when nobody is signed in.
 */
@Component({
  selector: 'sw-save-setup',
  imports: [MatButton, MatIcon],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (auth.signedIn()) {
      <button mat-stroked-button type="button" (click)="openSaveDialog()" [disabled]="disabled()">
        <mat-icon>bookmark_add</mat-icon>
        Save as set-up
      </button>
    }
  `,
})
export class SaveSetup {
  protected readonly auth = inject(Auth);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly router = inject(Router);

  /** The page's area. */
  readonly kind = input.required<SetupKind>();
  /** The page's form values to store. */
  readonly inputs = input.required<Readonly<Record<string, unknown>>>();
  /** A name to start from in the dialog. */
  readonly suggestedName = input('');
  /** Whether saving is not possible now (the inputs have a problem). */
  readonly disabled = input(false);

  /** Opens the dialog; when saved, tells the user with a link to reopen it. */
  protected openSaveDialog(): void {
    const data: SaveSetupData = { kind: this.kind(), inputs: this.inputs(), suggestedName: this.suggestedName() };
    this.dialog
      .open<SaveSetupDialog, SaveSetupData, SavedSetup>(SaveSetupDialog, { data, autoFocus: 'first-tabbable' })
      .afterClosed()
      .subscribe((saved) => {
        if (saved) this.announceSaved(saved);
      });
  }

  private announceSaved(saved: SavedSetup): void {
    const path = this.router.url.split('?')[0];
    this.snackBar
      .open(`Saved set-up “${saved.name}”`, 'Open', { duration: SAVED_NOTICE_MS })
      .onAction()
      .subscribe(() => void this.router.navigate([path], { queryParams: { [SETUP_PARAM]: saved.id } }));
  }
}
