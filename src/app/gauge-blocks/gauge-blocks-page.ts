import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';

import { GAUGE_BLOCK_CAUTIONS, type GaugeStackResult, calculateGaugeStack } from '../../../shared/calc/gauge-stack';
import type { LengthUnit } from '../../../shared/units/length-unit';
import { CalcPageLayout } from '../workbench/calc-page-layout';
import { CautionPanel } from '../workbench/caution-panel';
import { DerivationPanel } from '../workbench/derivation-panel';
import { controlMessage } from '../workbench/field-errors';
import { liveCalc } from '../workbench/live-calc';
import { bindQueryState } from '../workbench/query-state';
import { ResultList } from '../workbench/result-list';
import { SaveSetup } from '../workbench/save-setup';
import { UnitToggle, convertLengthControls } from '../workbench/unit-toggle';
import { WarningList } from '../workbench/warning-list';
import {
  GAUGE_BLOCKS_DEFAULTS, GAUGE_LENGTH_FIELDS, GRADE_OPTIONS, type GaugeBlocksFormValues, gaugeResultItems, gaugeSceneInput,
  gaugeSetsInUnit, toGaugeStackRequest,
} from './gauge-blocks-form';
import { GaugeStackDrawing } from './gauge-stack-drawing';

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
  /** The engine's answer, recomputed in the browser. */
  protected readonly calc = liveCalc<GaugeBlocksFormValues, GaugeStackResult>(this.form, (v) => calculateGaugeStack(toGaugeStackRequest(v)), {
    aliases: { 'missing.0': 'missing', unit: 'set' },
  });

  protected readonly cautions = GAUGE_BLOCK_CAUTIONS;
  protected readonly gradeOptions = GRADE_OPTIONS;
  protected readonly controlMessage = controlMessage;

  private readonly unitValue = toSignal(this.form.controls.unit.valueChanges, { initialValue: this.form.controls.unit.value });
  private readonly setValue = toSignal(this.form.controls.set.valueChanges, { initialValue: this.form.controls.set.value });

  /** The unit in use. */
  protected readonly unit = computed<LengthUnit>(() => (this.unitValue() === 'mm' ? 'mm' : 'in'));
  /** Sets in the unit. */
  protected readonly sets = computed(() => gaugeSetsInUnit(this.unit()));
  /** What the chosen set holds. */
  protected readonly setNotes = computed(() => this.sets().find((s) => s.id === this.setValue())?.notes ?? '');
  /** The result list. */
  protected readonly items = computed(() => {
    const r = this.calc.value();
    return r ? gaugeResultItems(r) : [];
  });
  /** The drawing's model. */
  protected readonly scene = computed(() => {
    const r = this.calc.value();
    return r ? gaugeSceneInput(r) : null;
  });
  /** A name to start the save dialog with. */
  protected readonly suggestedName = computed(() => `Stack ${this.calc.values().target} ${this.calc.values().unit}`);

  /** Converts the target, switches the unit and picks the first set of that unit. */
  protected changeUnit(to: LengthUnit): void {
    convertLengthControls(this.form.controls, GAUGE_LENGTH_FIELDS, this.unit(), to);
    this.form.controls.wearBlocks.setValue('', { emitEvent: false });
    this.form.patchValue({ unit: to, set: gaugeSetsInUnit(to)[0]?.id ?? '', missing: '' });
  }

  /** Opens the print dialog. */
  protected printSheet(): void {
    window.print();
  }
}
