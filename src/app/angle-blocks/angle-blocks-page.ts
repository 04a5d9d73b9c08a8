import { ChangeDetectionStrategy, Component, computed, effect, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { startWith } from 'rxjs';

import { type AngleBlocksResult, calculateAngleBlocks } from '../../../shared/calc/angle-blocks';
import { type CalcResult, invalid } from '../../../shared/calc/step';
import { boxIdOf } from '../../../shared/forms/gauge-blocks-form';
import { Auth } from '../core/auth';
import { InventoryApi } from '../inventory/inventory-api';
import { replacedBoxText } from '../gauge-blocks/own-boxes';
import { ANGLE_BLOCK_SETS } from '../../../shared/data/angle-block-sets';
import { CalcPageLayout } from '../workbench/calc-page-layout';
import { CautionPanel } from '../workbench/caution-panel';
import { DerivationPanel } from '../workbench/derivation-panel';
import { controlMessage } from '../workbench/field-errors';
import { liveCalc } from '../workbench/live-calc';
import { bindQueryState } from '../workbench/query-state';
import { type ResultItem, ResultList } from '../workbench/result-list';
import { SaveSetup } from '../workbench/save-setup';
import { WarningList } from '../workbench/warning-list';
import { AngleStackDrawing } from './angle-stack-drawing';
import type { StackBlockInput } from './angle-stack-geometry';
import { compactAngle, formatCombination } from '../../../shared/forms/combination-text';
import { type AngleBlocksForm, type AngleBlocksMode, boxBlockAngles, toAngleBlocksRequest } from '../../../shared/forms/angle-blocks-form';

export type { AngleBlocksForm, AngleBlocksMode } from '../../../shared/forms/angle-blocks-form';

/** Default set-up: a 17°35′ face on a fixture, made with the 13-piece set (REFERENCE.md §6 example). */
export const ANGLE_BLOCKS_DEFAULTS: AngleBlocksForm = {
  mode: 'find',
  set: 'angle-13-npl',
  angle: "17°35'",
  combination: "27° − 9° − 1° + 27′ + 9′ − 1′",
};

/** Cautions for setting work on angle blocks (REFERENCE.md §7). */
export const ANGLE_BLOCK_CAUTIONS: readonly string[] = [
  'Check the blocks for nicks and burrs before wringing and keep fingers off the gauging faces, as for gauge blocks (Starrett-Webber "Use and Care" GB45).',
  'Clamp the work and the blocks securely before the table moves toward the cutter; measure and adjust only with the spindle and work stopped (Michigan Admin. Code R 408.12640 "Milling").',
  'Keep the table, vise, blocks and work clean and free of chips, nicks and burrs (US Army TM 1-1500-204-23-8, machine-tool safety).',
];

/** The usable blocks (DMS text) of each of the team's angle-block boxes loaded so far, by box id. */
export type BoxBlocks = ReadonlyMap<number, readonly string[]>;

/**
 * Runs the engine on the form's request, or gives the failure naming the field. With one of the
 * team's boxes (`box:<id>`), the engine gets the blocks that are in it — count less missing and
 * damaged, as the inventory route solves — so a missing block is never used, and a typed
 * combination is checked against the box.
 */
export function angleBlocksRequest(values: AngleBlocksForm, boxes: BoxBlocks = new Map()): CalcResult<AngleBlocksResult> {
  const boxId = boxIdOf(values.set);
  const request = toAngleBlocksRequest(boxId === null ? values : { ...values, set: '' });
  if (!request.ok) return request;
  if (boxId === null) return calculateAngleBlocks(request.value);
  const blocks = boxes.get(boxId);
  if (!blocks) return invalid('Angle blocks', 'set', 'is one of your team\'s boxes: its blocks are still loading');
  if (blocks.length === 0) return invalid('Angle blocks', 'set', 'has every block marked missing or damaged');
  const { set: _set, ...rest } = request.value;
  return calculateAngleBlocks({ ...rest, blocks });
}

/** One of the team's angle-block boxes in the set picker. */
interface OwnAngleBox {
  readonly value: string;
  readonly label: string;
  /** "15 of 16 blocks usable (1 missing)". */
  readonly note: string;
}

/** The angle-block page: the fewest blocks for an angle, or the angle a combination makes. */
@Component({
  selector: 'sw-angle-blocks-page',
  imports: [
    ReactiveFormsModule, MatFormField, MatLabel, MatHint, MatError, MatInput, MatSelect, MatOption, MatButton, MatIcon,
    MatButtonToggleGroup, MatButtonToggle, CalcPageLayout, AngleStackDrawing, ResultList, WarningList, DerivationPanel,
    CautionPanel, SaveSetup,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './angle-blocks-page.html',
  styleUrl: './angle-blocks-page.scss',
})
export default class AngleBlocksPage {
  private readonly fb = inject(NonNullableFormBuilder);

  /** The inputs, as typed. */
  protected readonly form = this.fb.group({
    mode: this.fb.control<AngleBlocksMode>(ANGLE_BLOCKS_DEFAULTS.mode),
    set: ANGLE_BLOCKS_DEFAULTS.set,
    angle: ANGLE_BLOCKS_DEFAULTS.angle,
    combination: ANGLE_BLOCKS_DEFAULTS.combination,
  });
  /** The standard sets to pick from. */
  protected readonly sets = ANGLE_BLOCK_SETS;
  protected readonly cautions = ANGLE_BLOCK_CAUTIONS;
  protected readonly query = bindQueryState(this.form, 'angle-blocks');
  /** Blocks of the team's boxes, loaded when a box is chosen. */
  private readonly boxBlocks = new Map<number, readonly string[]>();
  protected readonly calc = liveCalc<AngleBlocksForm, AngleBlocksResult>(this.form, (v) => angleBlocksRequest(v, this.boxBlocks));
  /** The signed-in team's angle-block boxes (none for a visitor). */
  protected readonly ownBoxes = signal<readonly OwnAngleBox[]>([]);
  /** Set when a box named by the link or set-up could not be used. */
  protected readonly replacedBox = signal<string | null>(null);
  private readonly inventory = inject(InventoryApi);
  private readonly auth = inject(Auth);
  protected readonly controlMessage = controlMessage;

  private readonly values = toSignal(this.form.valueChanges.pipe(startWith(null)), { initialValue: null });
  /** The mode in use (follows the toggle at once, not after the recompute pause). */
  protected readonly mode = computed(() => {
    this.values();
    return this.form.controls.mode.value;
  });
  /** The form values to save as a set-up. */
  protected readonly inputs = computed(() => {
    this.values();
    return this.form.getRawValue() as unknown as Record<string, unknown>;
  });
  /** The chosen set, for its note. */
  protected readonly chosenSet = computed(() => {
    this.values();
    return ANGLE_BLOCK_SETS.find((s) => s.id === this.form.controls.set.value) ?? null;
  });
  /** The chosen team box, for its note. */
  protected readonly chosenBox = computed(() => {
    this.values();
    return this.ownBoxes().find((b) => b.value === this.form.controls.set.value) ?? null;
  });

  constructor() {
    // Signed in: the team's boxes join the picker; choosing one loads what is in it and recomputes.
    effect(() => {
      if (!this.auth.user()) {
        this.ownBoxes.set([]);
        return;
      }
      this.inventory.list().subscribe({
        next: (l) => this.ownBoxes.set(l.angleSets.map((b) => ({
          value: `box:${b.id}`,
          label: `Our box: ${b.name}`,
          note: `${b.totals.available} of ${b.totals.blocks} blocks usable${b.totals.missing + b.totals.damaged ? ` (${[b.totals.missing ? `${b.totals.missing} missing` : '', b.totals.damaged ? `${b.totals.damaged} damaged` : ''].filter(Boolean).join(', ')})` : ''}`,
        }))),
        error: () => this.ownBoxes.set([]),
      });
    });
    this.form.controls.set.valueChanges.pipe(startWith(this.form.controls.set.value), takeUntilDestroyed()).subscribe((set) => {
      if (set !== ANGLE_BLOCKS_DEFAULTS.set) this.replacedBox.set(null);
      this.loadBox(set);
    });
  }

  /** Loads a team box's usable blocks once, then recomputes with them. */
  private loadBox(set: string): void {
    const id = boxIdOf(set);
    if (id === null || this.boxBlocks.has(id)) return;
    this.inventory.get('angle-blocks', id).subscribe({
      next: (box) => {
        this.boxBlocks.set(id, boxBlockAngles(box.blocks ?? []));
        this.form.updateValueAndValidity();
      },
      error: () => {
        // Said, not silent: the box named by the link or set-up is not used.
        const instead = ANGLE_BLOCKS_DEFAULTS.set;
        this.form.controls.set.setValue(instead);
        this.replacedBox.set(replacedBoxText(id, this.auth.user() !== null, ANGLE_BLOCK_SETS.find((s) => s.id === instead)?.name ?? null, 'angle-block'));
      },
    });
  }

  /** The blocks for the drawing, from the plate upward. */
  protected readonly stack = computed<StackBlockInput[]>(() => {
    const r = this.calc.value();
    if (!r) return [];
    return r.blocks.map((b) => ({ angleDeg: Number(b.angleDeg), reversed: b.direction === 'reverse', label: compactAngle(b.angleDeg) }));
  });
  /** The combination's angle in short DMS for the drawing. */
  protected readonly totalText = computed(() => {
    const r = this.calc.value();
    return r ? compactAngle(r.achievedAngleDeg) : '';
  });
  /** The blocks written as a sum. */
  protected readonly combinationText = computed(() => {
    const r = this.calc.value();
    return r ? formatCombination(r.blocks.map((b) => ({ angleDeg: b.angleDeg, reversed: b.direction === 'reverse' }))) : '';
  });

  /** The numbers to show. */
  protected readonly results = computed<ResultItem[]>(() => {
    const r = this.calc.value();
    if (!r) return [];
    const items: ResultItem[] = [
      { label: 'Angle the blocks make', value: r.achievedAngleDms, unit: '', note: `${r.achievedAngleDeg}°`, emphasis: true },
      { label: 'Blocks', value: this.combinationText(), unit: '', note: '− = reversed (turned end for end)' },
      { label: 'Number of blocks', value: String(r.count), unit: r.count === 1 ? 'block' : 'blocks' },
    ];
    if (r.targetDms !== null) {
      items.push({ label: 'Wanted', value: r.targetDms, unit: '' });
      items.push({ label: 'Error', value: r.errorArcSec, unit: '″', note: r.exact ? 'Exact' : 'Nearest the set can make' });
    }
    return items;
  });

  /** Messages that belong to no single field. */
  protected readonly problems = computed(() => this.calc.messages().general);

  /** Copies the found blocks into the combination box to check or change them. */
  protected totalTheseBlocks(): void {
    const text = this.combinationText();
    if (!text) return;
    this.form.patchValue({ mode: 'total', combination: text });
  }
}
