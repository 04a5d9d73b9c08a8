import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { startWith } from 'rxjs';

import { type AngleBlocksResult, calculateAngleBlocks } from '../../../shared/calc/angle-blocks';
import type { CalcResult } from '../../../shared/calc/step';
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
import { type AngleBlocksForm, type AngleBlocksMode, toAngleBlocksRequest } from '../../../shared/forms/angle-blocks-form';

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

/** Runs the engine on the form's request, or gives the failure naming the field. */
export function angleBlocksRequest(values: AngleBlocksForm): CalcResult<AngleBlocksResult> {
  const request = toAngleBlocksRequest(values);
  return request.ok ? calculateAngleBlocks(request.value) : request;
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
  protected readonly calc = liveCalc<AngleBlocksForm, AngleBlocksResult>(this.form, angleBlocksRequest);
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
