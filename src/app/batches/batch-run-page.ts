import { DatePipe } from '@angular/common';
import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input, numberAttribute, signal, viewChild } from '@angular/core';
import { toObservable } from '@angular/core/rxjs-interop';
import { FormsModule, NgForm } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';

import type { BatchPartDto, BatchRunDto, PartReadings } from '../../../shared/api/batch';
import { DECIMAL_TEXT } from '../../../shared/api/setup';
import { inBand } from '../../../shared/batch/batch-stats';
import { apiErrorMessage, apiFieldErrors } from '../core/api-error';
import { Auth } from '../core/auth';
import { BatchChart } from './batch-chart';
import { BatchesApi, csvUrl } from './batches-api';

/** Entry of one part: readings as typed. */
interface PartEntry {
  touchOff: string;
  droAtStop: string;
  values: Record<string, string>;
  note: string;
}

const EMPTY: PartEntry = { touchOff: '', droAtStop: '', values: {}, note: '' };

/** A batch run at the machine: enter each part's readings, see pass/fail, the spread and the charts; close the run. */
@Component({
  selector: 'app-batch-run-page',
  imports: [DatePipe, FormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, BatchChart],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './batch-run-page.html',
  styleUrl: './batch-run-page.scss',
})
export default class BatchRunPage {
  private readonly api = inject(BatchesApi);
  private readonly auth = inject(Auth);

  /** Route parameter `:id`. */
  readonly id = input.required({ transform: numberAttribute });

  private readonly form = viewChild(NgForm);
  protected readonly run = signal<BatchRunDto | null>(null);
  protected readonly loadError = signal<string | null>(null);
  protected readonly entry = signal<PartEntry>(EMPTY);
  protected readonly saving = signal(false);
  protected readonly saveError = signal<string | null>(null);
  protected readonly fieldErrors = signal<Readonly<Record<string, string>>>({});
  /** What the last save did, for screen readers and a glance. */
  protected readonly saved = signal('');
  protected readonly csvUrl = csvUrl;

  protected readonly isOpen = computed(() => this.run()?.status === 'open');
  /** The lowest part not yet entered, as the server numbers a part sent without one. */
  protected readonly nextPart = computed(() => {
    const taken = new Set((this.run()?.parts ?? []).map((p) => p.partNo));
    let next = 1;
    while (taken.has(next)) next += 1;
    return next;
  });
  protected readonly full = computed(() => !!this.run() && this.nextPart() > (this.run()?.partCount ?? 0));
  /** The part being corrected (its readings loaded into the form), or null while recording the next part. */
  protected readonly correcting = signal<number | null>(null);
  /** Apprentices watch a run; everyone else records and corrects parts while it is open. */
  protected readonly mayWrite = computed(() => this.isOpen() && !!this.auth.user() && this.auth.user()?.role !== 'apprentice');
  protected readonly mayRecord = computed(() => this.mayWrite() && (this.correcting() !== null || !this.full()));
  /** The part the form writes: the one being corrected, else the next one. */
  protected readonly formPart = computed(() => this.correcting() ?? this.nextPart());
  protected readonly mayClose = computed(() => {
    const u = this.auth.user();
    const r = this.run();
    return !!u && !!r && r.status === 'open' && (u.role === 'lead' || u.role === 'admin' || (u.role === 'machinist' && r.startedById === u.id));
  });
  /** Live verdict of each typed value: in band, out of band, or not yet a number. */
  protected readonly liveVerdict = computed(() => {
    const r = this.run();
    const values = this.entry().values;
    const out: Record<string, 'pass' | 'fail' | null> = {};
    for (const c of r?.checks ?? []) {
      const v = (values[c.key] ?? '').trim();
      out[c.key] = DECIMAL_TEXT.test(v) ? (inBand(c, v) ? 'pass' : 'fail') : null;
    }
    return out;
  });

  constructor() {
    toObservable(this.id).subscribe((id) => this.load(id));
  }

  protected load(id: number): void {
    this.api.get(id).subscribe({ next: (r) => this.run.set(r), error: (err: unknown) => this.loadError.set(apiErrorMessage(err)) });
  }

  protected setValue(key: string, value: string): void {
    this.entry.update((e) => ({ ...e, values: { ...e.values, [key]: value } }));
  }

  protected setField(field: 'touchOff' | 'droAtStop' | 'note', value: string): void {
    this.entry.update((e) => ({ ...e, [field]: value }));
  }

  /** The readings as first recorded, in the run's check order: "End thickness 0.5805, DRO at stop -0.1632". */
  protected firstText(first: PartReadings, run: BatchRunDto): string {
    const out = run.checks.map((c) => `${c.label} ${first.values[c.key] ?? '—'}`);
    if (first.touchOff !== null) out.push(`touch-off ${first.touchOff}`);
    if (first.droAtStop !== null) out.push(`DRO at stop ${first.droAtStop}`);
    return out.join(', ');
  }

  /** Loads a recorded part's readings into the form to correct them. */
  protected startCorrecting(part: BatchPartDto): void {
    const values: Record<string, string> = {};
    for (const [key, value] of Object.entries(part.values)) values[key] = String(value);
    this.entry.set({ touchOff: part.touchOff ?? '', droAtStop: part.droAtStop ?? '', values, note: part.note ?? '' });
    this.correcting.set(part.partNo);
    this.saveError.set(null);
    this.fieldErrors.set({});
    document.getElementById('part-entry')?.scrollIntoView?.({ block: 'start' });
    (document.querySelector('#part-entry input') as HTMLInputElement | null)?.focus();
  }

  /** Leaves a correction unsaved and goes back to the next part. */
  protected cancelCorrecting(): void {
    this.correcting.set(null);
    this.fill(EMPTY);
    this.saveError.set(null);
    this.fieldErrors.set({});
  }

  /** Puts `entry` in the form as a fresh one: no box shows "required" until the next part is sent. */
  private fill(entry: PartEntry): void {
    this.entry.set(entry);
    const controls: Record<string, string> = { touchOff: entry.touchOff, droAtStop: entry.droAtStop, note: entry.note };
    for (const c of this.run()?.checks ?? []) controls[`v-${c.key}`] = entry.values[c.key] ?? '';
    this.form()?.resetForm(controls);
  }

  /** Records the next part (or saves the correction of one); on success the form clears for the next part. */
  protected record(): void {
    const r = this.run();
    if (!r) return;
    const e = this.entry();
    const partNo = this.correcting();
    const writing = this.formPart();
    this.saving.set(true);
    this.saveError.set(null);
    this.saved.set('');
    this.fieldErrors.set({});
    const body = { touchOff: e.touchOff || null, droAtStop: e.droAtStop || null, values: e.values, note: partNo === null ? e.note || undefined : e.note };
    const save = partNo === null ? this.api.addPart(r.id, body) : this.api.correctPart(r.id, partNo, body);
    save.subscribe({
      next: (res) => {
        this.run.set(res.run);
        this.correcting.set(null);
        this.fill(partNo === null ? { ...EMPTY, touchOff: e.touchOff } : EMPTY);
        this.saving.set(false);
        this.saved.set(partNo === null ? `Part ${res.part?.partNo ?? writing} recorded.` : `Part ${partNo} corrected.`);
      },
      error: (err: unknown) => {
        this.saving.set(false);
        this.fieldErrors.set(apiFieldErrors(err));
        this.saveError.set(apiErrorMessage(err));
        // Closed meanwhile by someone else: show the run as it is now (the form goes).
        if (err instanceof HttpErrorResponse && err.status === 409 && !Object.keys(apiFieldErrors(err)).length) this.load(r.id);
      },
    });
  }

  /** Closes the run after asking (it cannot be reopened); if someone closed it meanwhile, shows it as it is now. */
  protected close(): void {
    const r = this.run();
    if (!r) return;
    const entered = r.parts?.length ?? 0;
    if (!confirm(`Close run "${r.label || r.setupName}" with ${entered} of ${r.partCount} parts recorded? A closed run is kept as it is: no part can be added or corrected.`)) return;
    this.api.close(r.id).subscribe({
      next: (fresh) => this.run.set(fresh),
      error: () => this.api.get(r.id).subscribe({ next: (fresh) => this.run.set(fresh), error: () => undefined }),
    });
  }
}
