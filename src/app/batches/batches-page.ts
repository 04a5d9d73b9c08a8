import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import { catchError, map, of } from 'rxjs';

import { batchCreateBody, MAX_BATCH_PARTS, type BatchRunDto } from '../../../shared/api/batch';
import { apiErrorDetail, apiErrorMessage } from '../core/api-error';
import { Auth } from '../core/auth';
import { LibraryApi } from '../library/library-api';
import { BatchesApi } from './batches-api';

/** Batch runs of the team, and a form to start one from a released set-up. */
@Component({
  selector: 'app-batches-page',
  imports: [DatePipe, FormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, MatTableModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="page">
      <h1>Batch runs</h1>
      @if (mayRun()) {
        <form class="start" (ngSubmit)="start()" aria-label="Start a batch run">
          <mat-form-field appearance="outline" class="grow">
            <mat-label>Released set-up</mat-label>
            <mat-select name="setup" [value]="setupId()" (selectionChange)="setupId.set($event.value)">
              @for (s of released(); track s.id) {
                <mat-option [value]="s.id" [disabled]="!s.checks.length">{{ s.name }}{{ s.checks.length ? '' : ' (no check values)' }}</mat-option>
              }
            </mat-select>
          </mat-form-field>
          <mat-form-field appearance="outline" class="num" subscriptSizing="dynamic">
            <mat-label>Parts</mat-label>
            <input matInput type="number" name="parts" min="1" [max]="maxParts" [ngModel]="partCount()" (ngModelChange)="partCount.set($event)"
                   [attr.aria-invalid]="!!partCountError()" aria-describedby="parts-error" />
            @if (partCountError(); as pe) { <mat-hint id="parts-error" class="error">{{ pe }}</mat-hint> }
          </mat-form-field>
          <mat-form-field appearance="outline" class="grow" subscriptSizing="dynamic">
            <mat-label>Run name (optional)</mat-label>
            <input matInput name="label" maxlength="120" [ngModel]="label()" (ngModelChange)="label.set($event)" />
            <mat-hint>E.g. the lot or order; empty: job × parts</mat-hint>
          </mat-form-field>
          <button mat-flat-button type="submit" [disabled]="!setupId() || !!partCountError()"><mat-icon>play_arrow</mat-icon> Start run</button>
        </form>
        @if (startError(); as e) { <p class="error" role="alert">{{ e }}</p> }
      }
      <div class="table-frame">
        <table mat-table [dataSource]="runs()">
          <ng-container matColumnDef="label">
            <th mat-header-cell *matHeaderCellDef>Run</th>
            <td mat-cell *matCellDef="let r"><a [routerLink]="['/batches', r.id]">{{ r.label }}</a></td>
          </ng-container>
          <ng-container matColumnDef="setup">
            <th mat-header-cell *matHeaderCellDef>Set-up</th>
            <td mat-cell *matCellDef="let r"><a [routerLink]="['/library', r.setupId]">{{ r.setupName }}</a> v{{ r.setupVersion }}</td>
          </ng-container>
          <ng-container matColumnDef="status">
            <th mat-header-cell *matHeaderCellDef>Status</th>
            <td mat-cell *matCellDef="let r"><span class="chip" [class.open]="r.status === 'open'">{{ r.status === 'open' ? 'Open' : 'Closed' }}</span></td>
          </ng-container>
          <ng-container matColumnDef="parts">
            <th mat-header-cell *matHeaderCellDef>Parts</th>
            <td mat-cell *matCellDef="let r">{{ r.summary.entered }} / {{ r.partCount }} · <span [class.bad]="r.summary.failed">{{ r.summary.failed }} out of band</span></td>
          </ng-container>
          <ng-container matColumnDef="started">
            <th mat-header-cell *matHeaderCellDef>Started</th>
            <td mat-cell *matCellDef="let r">{{ r.createdAt | date: 'd MMM y, HH:mm' }} · {{ r.startedByName }}</td>
          </ng-container>
          <tr mat-header-row *matHeaderRowDef="columns"></tr>
          <tr mat-row *matRowDef="let row; columns: columns"></tr>
          <tr class="mat-mdc-row" *matNoDataRow><td class="empty" [attr.colspan]="columns.length">{{ listError() ?? 'No batch runs yet.' }}</td></tr>
        </table>
      </div>
    </section>
  `,
  styles: `
    .start { display: flex; flex-wrap: wrap; gap: 12px; align-items: flex-start; margin-bottom: 8px; }
    .grow { flex: 1 1 280px; }
    .num { width: 180px; }
    .table-frame { border: 1px solid var(--mat-sys-outline-variant); border-radius: 12px; overflow: auto; }
    table { width: 100%; }
    .chip { padding: 2px 10px; border-radius: 999px; background: var(--mat-sys-surface-container-high); }
    .chip.open { background: var(--mat-sys-tertiary-container); color: var(--mat-sys-on-tertiary-container); }
    .bad { color: var(--mat-sys-error); font-weight: 600; }
    .empty { padding: 24px 16px; color: var(--mat-sys-on-surface-variant); }
    .error { color: var(--mat-sys-error); }
  `,
})
export default class BatchesPage {
  private readonly api = inject(BatchesApi);
  private readonly library = inject(LibraryApi);
  private readonly auth = inject(Auth);
  private readonly router = inject(Router);

  protected readonly columns = ['label', 'setup', 'status', 'parts', 'started'];
  protected readonly setupId = signal<number | null>(null);
  protected readonly maxParts = MAX_BATCH_PARTS;
  /** The Parts box as typed (a number box gives null while empty or not a number). */
  protected readonly partCount = signal<number | null>(8);
  /** Why the Parts box cannot be sent, shown as it is typed (the same rule as the server's). */
  protected readonly partCountError = computed(() => {
    const parsed = batchCreateBody.shape.partCount.safeParse(this.partCount());
    return parsed.success ? null : (parsed.error.issues[0]?.message ?? 'Say how many parts the batch has.');
  });
  /** The run's name as typed (empty: the server names it after the job and the part count). */
  protected readonly label = signal('');
  protected readonly startError = signal<string | null>(null);
  protected readonly listError = signal<string | null>(null);
  protected readonly mayRun = computed(() => !!this.auth.user() && this.auth.user()?.role !== 'apprentice');

  protected readonly runs = toSignal(
    this.api.list().pipe(catchError((err: unknown) => {
      this.listError.set(apiErrorMessage(err));
      return of([] as BatchRunDto[]);
    })),
    { initialValue: [] as BatchRunDto[] },
  );
  protected readonly released = toSignal(this.library.list({ status: 'released', pageSize: 100, sort: 'name', dir: 'asc' }).pipe(map((p) => p.setups), catchError(() => of([]))), { initialValue: [] });

  protected start(): void {
    const setupId = this.setupId();
    const partCount = this.partCount();
    if (!setupId || partCount === null || this.partCountError()) return;
    this.startError.set(null);
    const label = this.label().trim();
    this.api.start({ setupId, partCount, ...(label ? { label } : {}) }).subscribe({
      next: (run) => void this.router.navigate(['/batches', run.id]),
      error: (err: unknown) => this.startError.set(apiErrorDetail(err)),
    });
  }
}
