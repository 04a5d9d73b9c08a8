import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, ElementRef, afterNextRender, computed, inject, Injector, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { catchError, map, of } from 'rxjs';

import { BLOCK_NOTE_MAX, blockSetDetailErrors, GAUGE_GRADES, hasWearPair, type InventoryBlockDto, type InventoryListDto, type InventorySetDto, type InventoryType } from '../../../shared/api/inventory';
import { blockLabel, readBlockList } from '../../../shared/forms/block-list';
import { apiErrorDetail, apiErrorMessage, apiFieldErrors } from '../core/api-error';
import { Auth } from '../core/auth';
import { boxFailureMessage } from '../gauge-blocks/own-boxes';
import { InventoryApi, type InventoryAnswer } from './inventory-api';

/** The shop's gauge-block and angle-block sets: what is in each box, missing and damaged blocks, and stacks from it. */
@Component({
  selector: 'app-inventory-page',
  imports: [FormsModule, MatButtonModule, MatButtonToggleModule, MatCheckboxModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './inventory-page.html',
  styleUrl: './inventory-page.scss',
})
export default class InventoryPage {
  private readonly api = inject(InventoryApi);
  private readonly auth = inject(Auth);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly injector = inject(Injector);

  protected readonly list = signal<InventoryListDto>({ gaugeSets: [], angleSets: [] });
  protected readonly selected = signal<InventorySetDto | null>(null);
  protected readonly wanted = signal('');
  protected readonly answer = signal<InventoryAnswer | null>(null);
  protected readonly answerError = signal<string | null>(null);
  /** Whether a gauge stack is built between the box's wear-block pair. */
  protected readonly useWear = signal(false);
  /** The block whose note is being written, with the text as typed (null: none). */
  protected readonly noteDraft = signal<{ blockId: number; text: string } | null>(null);
  protected readonly noteMax = BLOCK_NOTE_MAX;
  /** Whether a gauge set holds the pair of wear blocks a stack can be built between. */
  protected readonly wearPair = hasWearPair;
  /** Why marking a block was refused (someone changed the set meanwhile, no right, offline). */
  protected readonly markError = signal<string | null>(null);
  protected readonly newName = signal('');
  protected readonly newStandard = signal('');
  protected readonly createError = signal<string | null>(null);
  /** A box of the shop's own listed block by block (the "Start from" choices beside the standard ones). */
  protected readonly customChoices = [
    { id: CUSTOM_GAUGE, name: 'Our own gauge blocks' },
    { id: CUSTOM_ANGLE, name: 'Our own angle blocks' },
  ];
  protected readonly customType = computed<InventoryType | null>(() => (this.newStandard() === CUSTOM_GAUGE ? 'gauge-blocks' : this.newStandard() === CUSTOM_ANGLE ? 'angle-blocks' : null));
  protected readonly newUnit = signal<'in' | 'mm'>('in');
  protected readonly newBlocks = signal('');
  /** The typed list read as the API will take it, once something is typed. */
  protected readonly listed = computed(() => {
    const type = this.customType();
    if (!type || this.newBlocks().trim() === '') return null;
    return readBlockList(type, type === 'gauge-blocks' ? this.newUnit() : 'arcsec', this.newBlocks());
  });
  protected readonly listedError = computed(() => {
    const read = this.listed();
    return read && !read.ok ? read.error : null;
  });
  /** "36 sizes, 38 blocks, 0.050 in to 4.000 in" for the typed list. */
  protected readonly listedText = computed(() => {
    const read = this.listed();
    const type = this.customType();
    if (!read?.ok || !type) return '';
    const unit = type === 'gauge-blocks' ? this.newUnit() : 'arcsec';
    const sizes = read.blocks.length;
    const first = blockLabel(unit, read.blocks[0]!.size);
    const last = blockLabel(unit, read.blocks[sizes - 1]!.size);
    return `${sizes} ${sizes === 1 ? 'size' : 'sizes'}, ${read.total} ${read.total === 1 ? 'block' : 'blocks'}${sizes > 1 ? `, ${first} to ${last}` : `: ${first}`}`;
  });
  protected readonly mayManage = computed(() => this.auth.user()?.role === 'admin' || this.auth.user()?.role === 'lead');
  protected readonly isAdmin = computed(() => this.auth.user()?.role === 'admin');
  /** The details being edited (null: not editing), all as typed. */
  protected readonly draft = signal<{ name: string; grade: string; wearBlockSize: string; wearBlockCount: string; notes: string } | null>(null);
  protected readonly editErrors = signal<Readonly<Record<string, string>>>({});
  protected readonly editError = signal<string | null>(null);
  protected readonly gaugeGrades = GAUGE_GRADES;
  /** The standard composition's name for a set's id. */
  protected readonly standardName = (id: string | null) => (id === null ? 'custom set' : (this.standards().find((s) => s.id === id)?.name ?? id));
  protected readonly standards = toSignal(this.api.standardSets().pipe(map((r) => r.sets), catchError(() => of([]))), { initialValue: [] });
  protected readonly sets = computed(() => [...this.list().gaugeSets, ...this.list().angleSets]);

  constructor() {
    this.reload();
  }

  protected reload(selectId?: number): void {
    this.api.list().subscribe((l) => {
      this.list.set(l);
      const first = [...l.gaugeSets, ...l.angleSets].find((s) => s.id === selectId) ?? l.gaugeSets[0] ?? l.angleSets[0];
      if (first && !this.selected()) this.open(first);
    });
  }

  /**
   * Shows a set. `reveal`: it was tapped in the list, so its details are brought into view when
   * they sit below the list (one column, on a phone).
   */
  protected open(set: InventorySetDto, reveal = false): void {
    this.draft.set(null);
    this.noteDraft.set(null);
    this.answer.set(null);
    this.answerError.set(null);
    this.markError.set(null);
    this.api.get(set.type, set.id).subscribe((full) => {
      this.selected.set(full);
      if (reveal) afterNextRender(() => this.revealDetail(), { injector: this.injector });
    });
  }

  /** Scrolls the chosen set's details into view when their top is below the screen. */
  private revealDetail(): void {
    const detail = this.host.nativeElement.querySelector<HTMLElement>('.detail');
    if (!detail || typeof detail.scrollIntoView !== 'function') return;
    if (detail.getBoundingClientRect().top > window.innerHeight * 0.5) detail.scrollIntoView({ behavior: 'smooth', block: 'start' });
  }

  /** Starts writing the note of a block (why it is missing or damaged). */
  protected editNote(block: InventoryBlockDto): void {
    this.markError.set(null);
    this.noteDraft.set({ blockId: block.id, text: block.note });
  }

  /** Saves the note being written. */
  protected saveNote(block: InventoryBlockDto): void {
    const set = this.selected();
    const d = this.noteDraft();
    if (!set || !d || d.blockId !== block.id) return;
    const note = d.text.trim();
    if (note.length > BLOCK_NOTE_MAX) {
      this.markError.set(`${block.label}: keep the note under ${BLOCK_NOTE_MAX} characters.`);
      return;
    }
    this.markError.set(null);
    this.api.patchBlock(set.type, set.id, block.id, { note }).subscribe({
      next: (fresh) => {
        this.noteDraft.set(null);
        this.showFresh(fresh);
      },
      error: (err: unknown) => this.markError.set(`${block.label}: the note was not saved. ${apiErrorDetail(err)}`),
    });
  }

  protected mark(block: InventoryBlockDto, field: 'missing' | 'damaged', delta: number): void {
    const set = this.selected();
    if (!set) return;
    const next = Math.max(0, block[field] + delta);
    this.markError.set(null);
    this.api.patchBlock(set.type, set.id, block.id, { [field]: next }).subscribe({
      next: (fresh) => this.showFresh(fresh),
      error: (err: unknown) => {
        // Say why, and show the set as it is now (someone may have marked the block meanwhile).
        this.markError.set(`${block.label}: ${apiErrorDetail(err)} The set is shown as it is now.`);
        this.api.get(set.type, set.id).subscribe((fresh) => this.showFresh(fresh));
      },
    });
  }

  private showFresh(fresh: InventorySetDto): void {
    this.selected.set(fresh);
    this.list.update((l) => ({
      gaugeSets: l.gaugeSets.map((s) => (s.id === fresh.id ? { ...fresh, blocks: undefined } : s)),
      angleSets: l.angleSets.map((s) => (s.id === fresh.id ? { ...fresh, blocks: undefined } : s)),
    }));
  }

  protected findAnswer(): void {
    const set = this.selected();
    if (!set) return;
    this.answer.set(null);
    this.answerError.set(null);
    if (!this.wanted().trim()) {
      this.answerError.set(set.type === 'gauge-blocks' ? `Type the stack height, e.g. 1.2505 (${set.unit}).` : "Type the angle, e.g. 17°35'.");
      return;
    }
    const wear = hasWearPair(set) && this.useWear();
    this.api.answer(set.type, set.id, this.wanted().trim(), wear).subscribe({
      next: (a) => this.answer.set(a),
      error: (err: unknown) => this.answerError.set(boxFailureMessage(err)),
    });
  }

  /** Text of one block of an answer. */
  protected blockText(b: InventoryAnswer['blocks'][number]): string {
    return typeof b === 'string' ? b : `${b.direction === 'reverse' ? '−' : '+'}${b.angle}`;
  }

  /** Starts editing the chosen set's details. */
  protected edit(): void {
    const set = this.selected();
    if (!set) return;
    this.editErrors.set({});
    this.editError.set(null);
    this.draft.set({ name: set.name, grade: set.grade ?? '', wearBlockSize: set.wearBlockSize ?? '', wearBlockCount: String(set.wearBlockCount), notes: set.notes });
  }

  protected patchDraft(field: 'name' | 'grade' | 'wearBlockSize' | 'wearBlockCount' | 'notes', value: string): void {
    this.draft.update((d) => (d ? { ...d, [field]: value } : d));
  }

  /** Saves the details against the version shown; a change made meanwhile is reloaded and said. */
  protected saveDetails(): void {
    const set = this.selected();
    const d = this.draft();
    if (!set || !d) return;
    const gauge = set.type === 'gauge-blocks';
    const wearBlockSize = d.wearBlockSize.trim() === '' ? null : d.wearBlockSize.trim();
    // An empty count with a thickness is the pair; with none, no wear blocks.
    const count = d.wearBlockCount.trim() === '' ? (wearBlockSize ? 2 : 0) : Number(d.wearBlockCount);
    if (gauge && (!Number.isInteger(count) || count < 0)) {
      this.editErrors.set({ wearBlockCount: 'Type a whole number of wear blocks: 0 or 2.' });
      return;
    }
    const grade = d.grade.trim() === '' ? null : d.grade.trim();
    // The server's rule, said before sending: wear blocks are a pair with a thickness, or none.
    const wrong = blockSetDetailErrors(set.type, set.unit, { grade, ...(gauge ? { wearBlockSize, wearBlockCount: count } : {}) });
    if (Object.keys(wrong).length > 0) {
      this.editErrors.set(wrong);
      return;
    }
    this.editErrors.set({});
    this.editError.set(null);
    const body = {
      name: d.name,
      grade,
      ...(gauge ? { wearBlockSize, wearBlockCount: count } : {}),
      notes: d.notes,
      version: set.version,
    };
    this.api.update(set.type, set.id, body).subscribe({
      next: (fresh) => {
        this.draft.set(null);
        this.api.get(fresh.type, fresh.id).subscribe((full) => this.showFresh(full));
      },
      error: (err: unknown) => {
        this.editErrors.set(apiFieldErrors(err));
        this.editError.set(apiErrorMessage(err));
        if (err instanceof HttpErrorResponse && err.status === 409 && !apiFieldErrors(err)['name']) {
          // Changed by someone else meanwhile: show the set as it is now; the edit stays to apply again.
          this.api.get(set.type, set.id).subscribe((full) => this.showFresh(full));
        }
      },
    });
  }

  /** Deletes the chosen set after asking (admins). The server refuses while a saved set-up names it. */
  protected deleteSet(): void {
    const set = this.selected();
    if (!set) return;
    if (!confirm(`Delete the set "${set.name}" and its record of missing and damaged blocks? This cannot be undone. A set that saved set-ups use (archived ones too) is not deleted: they would lose their stacks, so save them with another set first.`)) return;
    this.editError.set(null);
    this.api.remove(set.type, set.id).subscribe({
      next: () => {
        this.selected.set(null);
        this.reload();
      },
      error: (err: unknown) => this.editError.set(`The set was not deleted: ${apiErrorMessage(err)}`),
    });
  }

  protected create(): void {
    const custom = this.customType();
    if (custom) {
      this.createCustom(custom);
      return;
    }
    const standard = this.standards().find((s) => s.id === this.newStandard());
    if (!standard) return;
    this.send(standard.type, { name: this.newName().trim() || standard.name, standardSet: standard.id });
  }

  /** A box of the shop's own: its name and the blocks listed, read here first so a wrong line is said at once. */
  private createCustom(type: InventoryType): void {
    this.createError.set(null);
    if (!this.newName().trim()) {
      this.createError.set('Give the set a name, e.g. "Long blocks, cabinet 3".');
      return;
    }
    const read = this.listed();
    if (!read) {
      this.createError.set('List the blocks in the box, one size per line.');
      return;
    }
    // A wrong line is already said under the list.
    if (!read.ok) return;
    this.send(type, { name: this.newName().trim(), blocks: read.blocks, ...(type === 'gauge-blocks' ? { unit: this.newUnit() } : {}) });
  }

  private send(type: InventoryType, body: Parameters<InventoryApi['create']>[1]): void {
    this.createError.set(null);
    this.api.create(type, body).subscribe({
      next: (set) => {
        this.newName.set('');
        this.newBlocks.set('');
        this.newStandard.set('');
        this.selected.set(set);
        this.reload(set.id);
      },
      error: (err: unknown) => this.createError.set(apiErrorDetail(err)),
    });
  }
}

/** "Start from" values of a box listed block by block. */
const CUSTOM_GAUGE = 'own-gauge-blocks';
const CUSTOM_ANGLE = 'own-angle-blocks';
