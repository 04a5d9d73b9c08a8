import { DatePipe, formatDate } from '@angular/common';
import { ChangeDetectionStrategy, Component, ElementRef, Injector, LOCALE_ID, afterNextRender, computed, inject, input, numberAttribute, signal, viewChild } from '@angular/core';
import { toObservable } from '@angular/core/rxjs-interop';
import { FormsModule, NgForm } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';

import type { BatchPartDto, BatchRunDto, PartReadings } from '../../../shared/api/batch';
import { inBand } from '../../../shared/batch/batch-stats';
import { farFromNominal, readReading } from '../../../shared/batch/reading';
import { apiErrorMessage, apiFieldErrors } from '../core/api-error';
import { Auth } from '../core/auth';
import { BatchChart } from './batch-chart';
import { BatchesApi, conflictRun, csvUrl } from './batches-api';

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
  imports: [DatePipe, FormsModule, RouterLink, MatButtonModule, MatCheckboxModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, BatchChart],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './batch-run-page.html',
  styleUrl: './batch-run-page.scss',
})
export default class BatchRunPage {
  private readonly api = inject(BatchesApi);
  private readonly auth = inject(Auth);
  private readonly locale = inject(LOCALE_ID);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly injector = inject(Injector);

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
  /** Why the typed readings were not saved when the form went away (run closed or full meanwhile), with the readings to note down. */
  protected readonly notice = signal<string | null>(null);
  /** The person confirmed that readings far from their nominal are right as typed. */
  protected readonly confirmFar = signal(false);
  /** The revision of the part being corrected, as the correction is based on it. */
  private readonly basedOn = signal<string | null>(null);
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
  /** Live verdict of each typed value: in band, out of band, far from the nominal (a slip?), or not yet a number. */
  protected readonly liveVerdict = computed(() => {
    const r = this.run();
    const values = this.entry().values;
    const out: Record<string, 'pass' | 'fail' | 'far' | null> = {};
    for (const c of r?.checks ?? []) {
      const read = readReading(values[c.key] ?? '');
      out[c.key] = !read.ok ? null : farFromNominal(c, read.text) ? 'far' : inBand(c, read.text) ? 'pass' : 'fail';
    }
    return out;
  });
  /** Whether any typed value is far from its nominal (the form then asks to confirm it). */
  protected readonly anyFar = computed(() => Object.values(this.liveVerdict()).includes('far'));

  constructor() {
    toObservable(this.id).subscribe((id) => this.load(id));
  }

  protected load(id: number): void {
    this.api.get(id).subscribe({ next: (r) => this.run.set(r), error: (err: unknown) => this.loadError.set(apiErrorMessage(err)) });
  }

  protected setValue(key: string, value: string): void {
    this.entry.update((e) => ({ ...e, values: { ...e.values, [key]: value } }));
    this.clearFieldError(`values.${key}`);
  }

  protected setField(field: 'touchOff' | 'droAtStop' | 'note', value: string): void {
    this.entry.update((e) => ({ ...e, [field]: value }));
    this.clearFieldError(field);
  }

  /** The server's word on a field no longer stands once the field is changed. */
  private clearFieldError(field: string): void {
    if (!(field in this.fieldErrors())) return;
    const { [field]: _gone, ...rest } = this.fieldErrors();
    this.fieldErrors.set(rest);
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
    this.basedOn.set(part.revision);
    this.confirmFar.set(false);
    this.saveError.set(null);
    this.fieldErrors.set({});
    document.getElementById('part-entry')?.scrollIntoView?.({ block: 'start' });
    (document.querySelector('#part-entry input') as HTMLInputElement | null)?.focus();
  }

  /** Leaves a correction unsaved and goes back to the next part. */
  protected cancelCorrecting(): void {
    this.correcting.set(null);
    this.basedOn.set(null);
    this.confirmFar.set(false);
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

  /** The typed readings in words, to note down when they could not be saved: "End thickness 0.5854, DRO at stop -0.1632, note “burr”". */
  private typedText(e: PartEntry, run: BatchRunDto): string {
    const out = run.checks.map((c) => `${c.label} ${(e.values[c.key] ?? '').trim() || '—'}`);
    if (e.touchOff.trim()) out.push(`touch-off ${e.touchOff.trim()}`);
    if (e.droAtStop.trim()) out.push(`DRO at stop ${e.droAtStop.trim()}`);
    if (e.note.trim()) out.push(`note “${e.note.trim()}”`);
    return out.join(', ');
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
    this.notice.set(null);
    this.fieldErrors.set({});
    const body = {
      touchOff: e.touchOff || null, droAtStop: e.droAtStop || null, values: e.values, note: partNo === null ? e.note || undefined : e.note,
      ...(this.confirmFar() && this.anyFar() ? { confirm: true } : {}),
    };
    // A new part names the part the form shows, so a part recorded meanwhile in another tab is not silently renumbered.
    const save = partNo === null ? this.api.addPart(r.id, { partNo: writing, ...body }) : this.api.correctPart(r.id, partNo, { ...body, revision: this.basedOn() ?? '' });
    save.subscribe({
      next: (res) => {
        this.run.set(res.run);
        this.correcting.set(null);
        this.basedOn.set(null);
        this.confirmFar.set(false);
        this.fill(partNo === null ? { ...EMPTY, touchOff: e.touchOff } : EMPTY);
        this.saving.set(false);
        this.saved.set(partNo === null ? `Part ${res.part?.partNo ?? writing} recorded.` : `Part ${partNo} corrected.`);
        // Ready for the next part: the cursor in its first reading (the touch-off carries over).
        afterNextRender(() => this.host.nativeElement.querySelector<HTMLInputElement>('#part-entry input[name^="v-"]')?.focus(), { injector: this.injector });
      },
      error: (err: unknown) => {
        this.saving.set(false);
        const fresh = conflictRun(err);
        if (!fresh) {
          this.fieldErrors.set(apiFieldErrors(err));
          this.saveError.set(apiErrorMessage(err));
          return;
        }
        // The run changed meanwhile: show it as it is now and keep what was typed.
        this.run.set(fresh);
        const typed = this.typedText(e, fresh);
        if (fresh.status === 'closed') {
          this.correcting.set(null);
          this.basedOn.set(null);
          const when = fresh.closedAt ? ` on ${formatDate(fresh.closedAt, 'd MMM y, HH:mm', this.locale)}` : '';
          this.notice.set(`Not saved: this run was closed${fresh.closedByName ? ` by ${fresh.closedByName}` : ''}${when}, so part ${writing} was not recorded. Your readings were: ${typed}. Note them down before leaving the page.`);
          return;
        }
        const current = partNo === null ? undefined : fresh.parts?.find((p) => p.partNo === partNo);
        if (current) {
          // Saving again replaces the part as it is now, knowingly.
          this.basedOn.set(current.revision);
          const by = current.correctedAt ? ` (corrected by ${current.correctedByName ?? 'a former member'}, ${formatDate(current.correctedAt, 'd MMM, HH:mm', this.locale)})` : '';
          this.saveError.set(`${apiErrorMessage(err)} Part ${partNo} now reads ${this.firstText({ touchOff: current.touchOff, droAtStop: current.droAtStop, values: current.values }, fresh)}${by}. Your readings are still in the form: save again to replace it with them, or cancel.`);
          return;
        }
        if (this.mayRecord()) {
          this.saveError.set(`${apiErrorMessage(err)} The form now shows part ${this.formPart()}; your readings are still in it. Check which part you measured before recording.`);
        } else {
          this.notice.set(`${apiErrorMessage(err)} Your readings were: ${typed}. Note them down.`);
        }
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
