import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
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

import type { InventoryBlockDto, InventoryListDto, InventorySetDto, InventoryType } from '../../../shared/api/inventory';
import { apiErrorDetail } from '../core/api-error';
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

  protected readonly list = signal<InventoryListDto>({ gaugeSets: [], angleSets: [] });
  protected readonly selected = signal<InventorySetDto | null>(null);
  protected readonly wanted = signal('');
  protected readonly answer = signal<InventoryAnswer | null>(null);
  protected readonly answerError = signal<string | null>(null);
  /** Whether a gauge stack is built between the box's wear-block pair. */
  protected readonly useWear = signal(false);
  /** Why marking a block was refused (someone changed the set meanwhile, no right, offline). */
  protected readonly markError = signal<string | null>(null);
  protected readonly newName = signal('');
  protected readonly newStandard = signal('');
  protected readonly createError = signal<string | null>(null);
  protected readonly mayManage = computed(() => this.auth.user()?.role === 'admin' || this.auth.user()?.role === 'lead');
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

  protected open(set: InventorySetDto): void {
    this.answer.set(null);
    this.answerError.set(null);
    this.markError.set(null);
    this.api.get(set.type, set.id).subscribe((full) => this.selected.set(full));
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
    const wear = set.type === 'gauge-blocks' && !!set.wearBlockSize && this.useWear();
    this.api.answer(set.type, set.id, this.wanted().trim(), wear).subscribe({
      next: (a) => this.answer.set(a),
      error: (err: unknown) => this.answerError.set(boxFailureMessage(err)),
    });
  }

  /** Text of one block of an answer. */
  protected blockText(b: InventoryAnswer['blocks'][number]): string {
    return typeof b === 'string' ? b : `${b.direction === 'reverse' ? '−' : '+'}${b.angle}`;
  }

  protected create(): void {
    const standard = this.standards().find((s) => s.id === this.newStandard());
    if (!standard) return;
    const type: InventoryType = standard.type;
    this.createError.set(null);
    this.api.create(type, { name: this.newName().trim() || standard.name, standardSet: standard.id }).subscribe({
      next: (set) => {
        this.newName.set('');
        this.selected.set(set);
        this.reload(set.id);
      },
      error: (err: unknown) => this.createError.set(apiErrorDetail(err)),
    });
  }
}
