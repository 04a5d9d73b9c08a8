import { ChangeDetectionStrategy, Component, computed, effect, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';

import { GAUGE_BLOCK_CAUTIONS, type GaugeStackResult } from '../../../shared/calc/gauge-stack';
import { blockLabel } from '../../../shared/forms/block-list';
import type { LengthUnit } from '../../../shared/units/length-unit';
import { CalcPageLayout } from '../workbench/calc-page-layout';
import { CautionPanel } from '../workbench/caution-panel';
import { DerivationPanel } from '../workbench/derivation-panel';
import { CALC_ERROR_KEY, controlMessage } from '../workbench/field-errors';
import { liveCalc } from '../workbench/live-calc';
import { bindQueryState } from '../workbench/query-state';
import { ResultList } from '../workbench/result-list';
import { SaveSetup } from '../workbench/save-setup';
import { UnitToggle, convertLengthControls } from '../workbench/unit-toggle';
import { WarningList } from '../workbench/warning-list';
import {
  GAUGE_BLOCKS_DEFAULTS, GAUGE_LENGTH_FIELDS, GRADE_OPTIONS, type GaugeBlocksFormValues, type GaugeOutcome, gaugeResultItems, gaugeSceneInput,
  gaugeSetsInUnit, runGaugeBlocks,
} from './gauge-blocks-form';
import { GaugeStackDrawing } from './gauge-stack-drawing';
import { bindOwnBoxes, boxStackState, excludedNote } from './own-boxes';

/** The standard set a unit starts with. */
const standardDefault = (unit: LengthUnit): string => gaugeSetsInUnit(unit)[0]?.id ?? '';

/** Gauge blocks: the fewest-block stack from the box in wringing order, beside the last-digit method. */
@Component({
  selector: 'sw-gauge-blocks-page',
  imports: [
    ReactiveFormsModule, MatFormFieldModule, MatInput, MatSelect, MatOption, MatButton, MatIcon,
    CalcPageLayout, CautionPanel, DerivationPanel, ResultList, SaveSetup, UnitToggle, WarningList, GaugeStackDrawing,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './gauge-blocks-page.html',
  styleUrl: './gauge-blocks-page.scss',
})
export default class GaugeBlocksPage {
  /** The inputs, as typed. */
  protected readonly form = inject(NonNullableFormBuilder).group({ ...GAUGE_BLOCKS_DEFAULTS });
  /** URL query and `?setup=` in step with the form. */
  protected readonly query = bindQueryState(this.form, 'gauge-blocks');
  /** The engine's answer (standard sets), or the checked query for the team's box; recomputed after each pause in typing. */
  protected readonly calc = liveCalc<GaugeBlocksFormValues, GaugeOutcome>(this.form, runGaugeBlocks, {
    aliases: { 'missing.0': 'missing', unit: 'set' },
  });

  protected readonly cautions = GAUGE_BLOCK_CAUTIONS;
  protected readonly controlMessage = controlMessage;

  private readonly unitValue = toSignal(this.form.controls.unit.valueChanges, { initialValue: this.form.controls.unit.value });
  private readonly setValue = toSignal(this.form.controls.set.valueChanges, { initialValue: this.form.controls.set.value });

  /** The unit in use. */
  protected readonly unit = computed<LengthUnit>(() => (this.unitValue() === 'mm' ? 'mm' : 'in'));
  /** The signed-in team's gauge-block sets (none for a visitor). */
  /** Set when a box named by the link or set-up could not be used. */
  protected readonly replacedBox = signal<string | null>(null);
  private readonly boxes = bindOwnBoxes(this.form.controls.set, this.unit, standardDefault, this.replacedBox);
  /** The team's set chosen, or null for a standard set. */
  protected readonly ownBox = computed(() => this.boxes().find((b) => b.value === this.setValue()) ?? null);
  /** The stack from the box, asked of the inventory route (only for a set the team's list holds). */
  protected readonly boxState = boxStackState(
    computed(() => {
      const o = this.calc.value();
      return o?.source === 'box' && this.ownBox() ? o.query : null;
    }),
  );
  /** The picker: the team's own sets in the unit first, then the standard sets. */
  protected readonly sets = computed(() => [
    ...this.boxes().filter((b) => b.unit === this.unit()).map((b) => ({ id: b.value, name: b.label, notes: b.notes })),
    ...gaugeSetsInUnit(this.unit()),
  ]);
  /** What the chosen set holds. */
  protected readonly setNotes = computed(() => this.sets().find((s) => s.id === this.setValue())?.notes ?? '');
  /** Grade choices; for the team's box a blank grade means the grade recorded for it. */
  protected readonly gradeOptions = computed(() => {
    const box = this.ownBox();
    return box ? GRADE_OPTIONS.map((g) => (g.value === '' ? { value: '', label: `The box's grade (${box.grade ?? 'none recorded'})` } : g)) : GRADE_OPTIONS;
  });
  /** The answer shown: the engine's, or the box's (the previous one while a newer is on its way). */
  protected readonly answer = computed<GaugeStackResult | null>(() => {
    const o = this.calc.value();
    if (!o) return null;
    if (o.source === 'engine') return o.result;
    const st = this.boxState();
    return st.status === 'done' || st.status === 'loading' ? st.answer : null;
  });
  /** Whether the box's stack is being asked for. */
  protected readonly asking = computed(() => this.calc.value()?.source === 'box' && this.boxState().status === 'loading');
  /** A box answer refused for one of the form's own fields marks that field too, not only the problem list. */
  private readonly markRefusedField = effect(() => {
    const st = this.boxState();
    if (st.status !== 'failed' || this.calc.value()?.source !== 'box') return;
    const name = st.field === 'target' || st.field === 'wearBlocks' || st.field === 'grade' ? st.field : null;
    if (!name) return;
    const control = this.form.controls[name];
    control.setErrors({ ...(control.errors ?? {}), [CALC_ERROR_KEY]: st.message });
    control.markAsTouched();
  });

  /** Why the box cannot give the stack, for the problem list. */
  protected readonly boxProblems = computed(() => {
    const st = this.boxState();
    return this.calc.value()?.source === 'box' && st.status === 'failed' ? [st.message] : [];
  });
  /** The blocks the inventory leaves out of the solve, as a note (empty when none). */
  protected readonly leftOut = computed(() => {
    const st = this.boxState();
    const list = st.status === 'failed' ? st.excluded : st.status === 'idle' ? [] : (st.answer?.excluded ?? []);
    const unit = this.unit();
    // Sizes as the inventory writes them ("0.050 in", not "0.05 in"): its label without the unit.
    const suffix = ` ${unit}`;
    return excludedNote(list.map((b) => ({ ...b, size: blockLabel(unit, b.size).slice(0, -suffix.length) })), unit);
  });
  /** The result list. */
  protected readonly items = computed(() => {
    const r = this.answer();
    return r ? gaugeResultItems(r) : [];
  });
  /** The drawing's model. */
  protected readonly scene = computed(() => {
    const r = this.answer();
    return r ? gaugeSceneInput(r) : null;
  });
  /** A name to start the save dialog with. */
  protected readonly suggestedName = computed(() => `Stack ${this.calc.values().target} ${this.calc.values().unit}`);

  /** Converts the target, switches the unit and picks the first set of that unit. */
  protected changeUnit(to: LengthUnit): void {
    convertLengthControls(this.form.controls, GAUGE_LENGTH_FIELDS, this.unit(), to);
    this.form.controls.wearBlocks.setValue('', { emitEvent: false });
    const own = this.boxes().find((b) => b.unit === to);
    this.form.patchValue({ unit: to, set: own?.value ?? standardDefault(to), missing: '' });
  }

  /** A new set: the missing list and wear blocks belonged to the old one. */
  protected setChosen(): void {
    this.form.patchValue({ missing: '', wearBlocks: '' });
  }

  /** Opens the print dialog. */
  protected printSheet(): void {
    window.print();
  }
}
