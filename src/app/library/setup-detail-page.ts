import { DatePipe } from '@angular/common';
import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input, numberAttribute, signal } from '@angular/core';
import { toObservable } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { type Params, Router, RouterLink } from '@angular/router';
import { forkJoin } from 'rxjs';

import { batchCreateBody, type BatchRunDto } from '../../../shared/api/batch';
import { CHECK_UNITS, type AttachmentDto, type RevisionDto, type SetupCheck, type SetupDto } from '../../../shared/api/setup';
import { inputRows, setupResults, type ResultLine } from '../../../shared/library/setup-results';
import { type TeamBoxes, namedBox, teamBoxOf } from '../../../shared/library/team-boxes';
import { InventoryApi } from '../inventory/inventory-api';
import { apiErrorMessage, apiFieldErrors } from '../core/api-error';
import { Auth } from '../core/auth';
import { ErrorNotice } from '../core/error-notice';
import { BatchesApi } from '../batches/batches-api';
import { checkFromResult, checkKey, DEFAULT_TOLERANCE } from './check-suggestions';
import { historyFieldLabel } from './history-field';
import { attachmentUrl, exportUrl, KIND_AREAS, LibraryApi, sheetUrl, STATUS_LABELS, thumbnailUrl } from './library-api';
import { returnParams } from './library-url';

/** Largest upload the page lets through before asking the server (the server has the final say). */
const MAX_UPLOAD_MB = 20;

/** One set-up: inputs, results, checks, notes, attachments, history and batch runs, with the actions the role allows. */
@Component({
  selector: 'app-setup-detail-page',
  imports: [DatePipe, FormsModule, RouterLink, MatButtonModule, MatExpansionModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './setup-detail-page.html',
  styleUrl: './setup-detail-page.scss',
})
export default class SetupDetailPage {
  private readonly api = inject(LibraryApi);
  private readonly batches = inject(BatchesApi);
  private readonly inventory = inject(InventoryApi);
  private readonly auth = inject(Auth);
  private readonly notice = inject(ErrorNotice);
  private readonly router = inject(Router);

  /**
   * The list's address this page was opened from (its filters, sort and page, handed over by the
   * list's row link), for the "Set-up library" link back to it as it was.
   */
  protected readonly listParams: Params = returnParams(this.router.currentNavigation()?.extras.state ?? (typeof history === 'undefined' ? null : history.state));

  /** Route parameter `:id`. */
  readonly id = input.required({ transform: numberAttribute });

  protected readonly setup = signal<SetupDto | null>(null);
  protected readonly revisions = signal<RevisionDto[]>([]);
  /** A history entry's field in words. */
  protected readonly fieldLabel = historyFieldLabel;
  protected readonly attachments = signal<AttachmentDto[]>([]);
  protected readonly runs = signal<BatchRunDto[]>([]);
  protected readonly loadError = signal<string | null>(null);
  protected readonly uploadPercent = signal<number | null>(null);
  protected readonly uploadError = signal<string | null>(null);
  protected readonly editing = signal(false);
  protected readonly saveError = signal<string | null>(null);
  protected readonly fieldErrors = signal<Readonly<Record<string, string>>>({});
  /** Field messages with no box of their own beside them (e.g. a check's unit, the list of checks), said with the summary. */
  protected readonly otherFieldErrors = computed(() =>
    Object.entries(this.fieldErrors())
      .filter(([path]) => !/^(name|job|notes|checks\.\d+\.(label|nominal|plus|minus))$/.test(path))
      .map(([, message]) => message),
  );
  protected readonly draft = signal<{ name: string; job: string; notes: string; checks: SetupCheck[] }>({ name: '', job: '', notes: '', checks: [] });
  /** The part count as typed (checked with the API's own rule before it is sent). */
  protected readonly partCount = signal('8');
  /** What is wrong with the part count (the form's check, or the server's), shown under the field. */
  protected readonly partCountError = signal<string | null>(null);
  /** The run's name as typed (empty: the server names it after the job and the part count). */
  protected readonly runLabel = signal('');
  protected readonly startError = signal<string | null>(null);

  protected readonly units = CHECK_UNITS;
  protected readonly statusLabels = STATUS_LABELS;
  protected readonly sheetUrl = sheetUrl;
  protected readonly exportUrl = exportUrl;
  protected readonly attachmentUrl = attachmentUrl;
  protected readonly thumbnailUrl = thumbnailUrl;

  protected readonly area = computed(() => KIND_AREAS[this.setup()?.kind ?? ''] ?? null);
  /**
   * The team box the set-up names, with what is in it now: a map without it when it is gone (not in
   * the team's inventory), undefined while it is asked for or could not be read (then the set-up is
   * answered on its page only).
   */
  protected readonly boxes = signal<TeamBoxes | undefined>(undefined);
  /** Whether that box is being asked for. */
  protected readonly boxLoading = signal(false);
  protected readonly results = computed(() => {
    const s = this.setup();
    return s ? setupResults(s.kind, s.inputs, this.boxes()) : null;
  });
  /** The figures the calculation used and the set-up's own fields, as the set-up sheet lists them. */
  protected readonly inputs = computed(() => {
    const s = this.setup();
    const r = this.results();
    if (!s || !r) return [];
    return inputRows(s.kind, s.inputs, r).map((row) => ({ key: row.label, value: row.value }));
  });
  protected readonly role = computed(() => this.auth.user()?.role ?? null);
  protected readonly isLead = computed(() => this.role() === 'lead' || this.role() === 'admin');
  protected readonly mayEdit = computed(() => {
    const s = this.setup();
    const u = this.auth.user();
    return !!s && !!u && s.status !== 'archived' && (this.isLead() || s.ownerId === u.id);
  });
  /**
   * Whether this member may delete the set-up: a draft that was never released and has no runs, by
   * its owner or a lead (the server has the same rule; anything else is archived by a lead).
   */
  protected readonly mayDelete = computed(() => {
    const s = this.setup();
    const u = this.auth.user();
    return !!s && !!u && s.status === 'draft' && s.releasedVersion === null && this.runs().length === 0 && (this.isLead() || s.ownerId === u.id);
  });
  protected readonly deleteError = signal<string | null>(null);
  protected readonly mayRun = computed(() => this.setup()?.status === 'released' && (this.setup()?.checks.length ?? 0) > 0 && this.role() !== 'apprentice');

  constructor() {
    toObservable(this.id).subscribe((id) => this.load(id));
  }

  /** Loads the set-up and everything shown with it. */
  protected load(id: number): void {
    this.loadError.set(null);
    forkJoin({ setup: this.api.get(id), revisions: this.api.revisions(id), attachments: this.api.attachments(id), runs: this.batches.list({ setupId: id }) }).subscribe({
      next: (r) => {
        this.setup.set(r.setup);
        this.loadBox(r.setup);
        this.revisions.set(r.revisions);
        this.attachments.set(r.attachments);
        this.runs.set(r.runs);
      },
      error: (err: unknown) => this.loadError.set(apiErrorMessage(err)),
    });
  }
  /**
   * Loads the team box the set-up names, so its results are answered with what is in the box now,
   * as its calculator page answers them; a box that is gone leaves them to the page.
   */
  private loadBox(setup: SetupDto): void {
    const named = namedBox(setup.kind, setup.inputs);
    if (!named) {
      this.boxes.set(new Map());
      return;
    }
    if (this.boxes()?.has(named.id)) return;
    this.boxLoading.set(true);
    this.inventory.get(named.type, named.id, true).subscribe({
      next: (set) => {
        this.boxes.set(new Map([[set.id, teamBoxOf(set)]]));
        this.boxLoading.set(false);
      },
      error: (err: unknown) => {
        // Not in the team's inventory (deleted): said as such. Unreadable for now: left to the page.
        this.boxes.set(err instanceof HttpErrorResponse && err.status === 404 ? new Map() : undefined);
        this.boxLoading.set(false);
      },
    });
  }


  private refreshHistory(id: number): void {
    this.api.revisions(id).subscribe((r) => this.revisions.set(r));
  }

  /** Why this set-up cannot be released (its inputs do not compute), or null; the server refuses it too. */
  protected readonly releaseBlocked = computed(() => {
    const r = this.results();
    return r && !r.ok && !r.pageOnly ? `Cannot be released: it does not compute (${r.error}).` : null;
  });

  protected release(): void {
    const s = this.setup();
    if (!s) return;
    this.api.release(s.id, s.version).subscribe((fresh) => {
      this.setup.set(fresh);
      this.refreshHistory(fresh.id);
    });
  }

  protected archive(): void {
    const s = this.setup();
    if (!s) return;
    this.api.archive(s.id, s.version).subscribe((fresh) => {
      this.setup.set(fresh);
      this.refreshHistory(fresh.id);
    });
  }

  protected startEdit(): void {
    const s = this.setup();
    if (!s) return;
    this.draft.set({ name: s.name, job: s.job ?? '', notes: s.notes, checks: s.checks.map((c) => ({ ...c })) });
    this.saveError.set(null);
    this.fieldErrors.set({});
    this.editing.set(true);
  }

  protected patchDraft(patch: Partial<{ name: string; job: string; notes: string }>): void {
    this.draft.update((d) => ({ ...d, ...patch }));
  }

  protected patchCheck(index: number, patch: Partial<SetupCheck>): void {
    this.draft.update((d) => ({ ...d, checks: d.checks.map((c, i) => (i === index ? { ...c, ...patch, key: patch.label !== undefined ? checkKey(patch.label) : c.key } : c)) }));
  }

  protected addCheck(check?: SetupCheck): void {
    const unit = this.setup()?.inputs['unit'] === 'mm' ? 'mm' : 'in';
    const next = check ?? { key: `check-${this.draft().checks.length + 1}`, label: '', unit, nominal: '', plus: DEFAULT_TOLERANCE[unit], minus: DEFAULT_TOLERANCE[unit] };
    if (this.draft().checks.some((c) => c.key === next.key)) return;
    this.draft.update((d) => ({ ...d, checks: [...d.checks, next] }));
  }

  protected removeCheck(index: number): void {
    this.draft.update((d) => ({ ...d, checks: d.checks.filter((_, i) => i !== index) }));
  }

  /** A result line that can become a check value (a single number). */
  protected suggestion(line: ResultLine): SetupCheck | null {
    return checkFromResult(line, this.setup()?.inputs['unit'] === 'mm' ? 'mm' : 'in');
  }

  protected addResultAsCheck(line: ResultLine): void {
    const check = this.suggestion(line);
    if (!check) return;
    if (!this.editing()) this.startEdit();
    this.addCheck(check);
  }

  protected save(): void {
    const s = this.setup();
    if (!s) return;
    const d = this.draft();
    this.api.update(s.id, { name: d.name, kind: s.kind, inputs: s.inputs, notes: d.notes, job: d.job.trim() || null, checks: d.checks, version: s.version }).subscribe({
      next: (fresh) => {
        this.setup.set(fresh);
        this.editing.set(false);
        this.refreshHistory(fresh.id);
      },
      error: (err: unknown) => {
        this.fieldErrors.set(apiFieldErrors(err));
        this.saveError.set(err instanceof HttpErrorResponse && err.status === 409 ? 'Someone changed this set-up while you were editing. Reload to see their change, then edit again.' : apiErrorMessage(err));
      },
    });
  }

  protected upload(input: HTMLInputElement): void {
    const s = this.setup();
    const file = input.files?.[0];
    input.value = '';
    if (!s || !file) return;
    this.uploadError.set(null);
    if (file.size > MAX_UPLOAD_MB * 1024 * 1024) {
      this.uploadError.set(`The file is larger than the ${MAX_UPLOAD_MB} MB limit.`);
      return;
    }
    if (s.status === 'released' && !confirm(`Attach "${file.name}"? ${this.backToDraft()}`)) return;
    this.uploadPercent.set(0);
    this.api.upload(s.id, file).subscribe({
      next: (p) => {
        if (p.done) {
          this.attachments.update((list) => [...list, p.attachment]);
          this.uploadPercent.set(null);
          this.afterFileChange(s);
        } else {
          this.uploadPercent.set(p.percent);
        }
      },
      error: (err: unknown) => {
        this.uploadPercent.set(null);
        this.uploadError.set(apiErrorMessage(err));
      },
    });
  }

  /** The unit of an answer's lengths ("in", "mm"). */
  protected unitOf(r: { value: Record<string, unknown> }): string {
    return typeof r.value['unit'] === 'string' ? r.value['unit'] : '';
  }

  /** What a file change does to a released set-up, said before it is made. */
  private backToDraft(): string {
    const lead = this.role() === 'lead' || this.role() === 'admin';
    return `The set-up is released: its files are part of what was released, so it becomes a draft again until ${lead ? 'you or another lead release' : 'a lead releases'} it.`;
  }

  /** After a file is attached or removed: the history, and the set-up itself when it was released (now a draft). */
  private afterFileChange(before: SetupDto): void {
    this.refreshHistory(before.id);
    if (before.status === 'released') this.api.get(before.id).subscribe((fresh) => this.setup.set(fresh));
  }

  /** A file's size as people read it: bytes under 1 KB, else KB or MB. */
  protected sizeText(bytes: number): string {
    if (bytes < 1024) return `${bytes} ${bytes === 1 ? 'byte' : 'bytes'}`;
    if (bytes < 1024 * 1024) return `${Math.round(bytes / 1024)} KB`;
    return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
  }

  protected removeAttachment(a: AttachmentDto): void {
    const s = this.setup();
    const released = s?.status === 'released' ? ` ${this.backToDraft()}` : '';
    if (!confirm(`Remove "${a.fileName}" from this set-up? The stored file is deleted and cannot be brought back.${released}`)) return;
    this.uploadError.set(null);
    this.api.removeAttachment(a.setupId, a.id).subscribe({
      next: () => {
        this.attachments.update((list) => list.filter((x) => x.id !== a.id));
        if (s) this.afterFileChange(s);
      },
      error: (err: unknown) => this.uploadError.set(`"${a.fileName}" was not removed: ${apiErrorMessage(err)}`),
    });
  }

  protected setPartCount(text: string): void {
    this.partCount.set(text);
    this.partCountError.set(null);
  }

  protected startRun(): void {
    const s = this.setup();
    if (!s) return;
    this.startError.set(null);
    // The API's own rule, so the reason is said here before anything is sent.
    const text = String(this.partCount() ?? '').trim();
    const count = batchCreateBody.shape.partCount.safeParse(text === '' ? undefined : Number(text));
    if (!count.success) {
      this.partCountError.set(count.error.issues[0]?.message ?? 'Say how many parts the batch has.');
      return;
    }
    this.partCountError.set(null);
    const label = this.runLabel().trim();
    this.batches.start({ setupId: s.id, partCount: count.data, ...(label ? { label } : {}) }).subscribe({
      next: (run) => void this.router.navigate(['/batches', run.id]),
      error: (err: unknown) => {
        const fields = apiFieldErrors(err);
        if (fields['partCount']) this.partCountError.set(fields['partCount']);
        const others = Object.entries(fields).filter(([k]) => k !== 'partCount').map(([, m]) => m);
        const message = apiErrorMessage(err);
        this.startError.set(fields['partCount'] && others.length === 0 ? null : [message, ...others.filter((m) => !message.includes(m))].join(' '));
      },
    });
  }

  /** Deletes a draft that was never released, after asking; back to the list it came from. */
  protected remove(): void {
    const s = this.setup();
    if (!s || !this.mayDelete()) return;
    if (!confirm(`Delete the draft "${s.name}"? It is removed from the library with its files and history, and cannot be brought back.`)) return;
    this.deleteError.set(null);
    this.api.remove(s.id).subscribe({
      next: () => void this.router.navigate(['/library'], { queryParams: this.listParams }),
      error: (err: unknown) => this.deleteError.set(`The set-up was not deleted: ${apiErrorMessage(err)}`),
    });
  }

  protected showNotice(message: string): void {
    void this.notice.show(message);
  }
}
