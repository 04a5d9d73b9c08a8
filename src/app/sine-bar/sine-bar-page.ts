import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';

import { SINE_BAR_CAUTIONS, type SineBarResult, calculateSineBar } from '../../../shared/calc/sine-bar';
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
import { SineBarDrawing } from './sine-bar-drawing';
import {
  BAR_LENGTHS, SINE_BAR_DEFAULTS, SINE_BAR_LENGTH_FIELDS, type SineBarFormValues, defaultSet, setsInUnit, sineBarResultItems,
  sineBarSceneInput, toSineBarRequest,
} from './sine-bar-form';

/** Sine bar & plate: the stack for an angle or the angle of a stack, with the blocks drawn under the roll. */
@Component({
  selector: 'sw-sine-bar-page',
  imports: [
    ReactiveFormsModule, MatFormFieldModule, MatInput, MatSelect, MatOption, MatButton, MatButtonToggleGroup, MatButtonToggle, MatIcon,
    CalcPageLayout, CautionPanel, DerivationPanel, ResultList, SaveSetup, UnitToggle, WarningList, SineBarDrawing,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './sine-bar-page.html',
  styleUrl: './sine-bar-page.scss',
})
export default class SineBarPage {
  /** The inputs, as typed. */
  protected readonly form = inject(NonNullableFormBuilder).group({ ...SINE_BAR_DEFAULTS });
  /** URL query and `?setup=` in step with the form. */
  protected readonly query = bindQueryState(this.form, 'sine-bar');
  /** The engine's answer, recomputed in the browser. */
  protected readonly calc = liveCalc<SineBarFormValues, SineBarResult>(this.form, (v) => calculateSineBar(toSineBarRequest(v)), {
    aliases: { 'missing.0': 'missing' },
  });

  protected readonly cautions = SINE_BAR_CAUTIONS;
  protected readonly controlMessage = controlMessage;

  private readonly unitValue = toSignal(this.form.controls.unit.valueChanges, { initialValue: this.form.controls.unit.value });
  private readonly modeValue = toSignal(this.form.controls.mode.valueChanges, { initialValue: this.form.controls.mode.value });
  private readonly setValue = toSignal(this.form.controls.set.valueChanges, { initialValue: this.form.controls.set.value });

  /** The unit in use. */
  protected readonly unit = computed<LengthUnit>(() => (this.unitValue() === 'mm' ? 'mm' : 'in'));
  /** Whether the stack is worked out from an angle (otherwise the angle from a stack). */
  protected readonly byAngle = computed(() => this.modeValue() !== 'stack');
  /** Whether a set of blocks is chosen. */
  protected readonly hasSet = computed(() => this.setValue() !== '');
  /** Sets in the unit in use. */
  protected readonly sets = computed(() => setsInUnit(this.unit()));
  /** One-tap bar lengths for the unit. */
  protected readonly barLengths = computed(() => BAR_LENGTHS[this.unit()]);
  /** The result list. */
  protected readonly items = computed(() => {
    const r = this.calc.value();
    return r ? sineBarResultItems(r, this.calc.values().mode !== 'stack') : [];
  });
  /** The drawing's model. */
  protected readonly scene = computed(() => {
    const r = this.calc.value();
    return r ? sineBarSceneInput(r) : null;
  });
  /** For a steep angle: the same bar set at the complement, as advised. */
  protected readonly complement = computed(() => {
    const r = this.calc.value();
    const v = this.calc.values();
    if (!r || v.mode === 'stack' || Number(r.angleDeg) <= 45) return null;
    const other = calculateSineBar({ ...toSineBarRequest(v), angle: r.complementDeg });
    return other.ok ? other.value : null;
  });
  /** The complement drawing's model. */
  protected readonly complementScene = computed(() => {
    const c = this.complement();
    return c ? sineBarSceneInput(c) : null;
  });
  /** A name to start the save dialog with. */
  protected readonly suggestedName = computed(() => {
    const v = this.calc.values();
    return v.mode === 'stack' ? `Sine bar ${v.barLength} ${v.unit}, stack ${v.stackHeight}` : `Sine bar ${v.barLength} ${v.unit} at ${v.angle}`;
  });

  /** Converts the lengths, switches the unit and picks a set in the new unit. */
  protected changeUnit(to: LengthUnit): void {
    convertLengthControls(this.form.controls, SINE_BAR_LENGTH_FIELDS, this.unit(), to);
    this.form.patchValue({ unit: to, set: this.hasSet() ? defaultSet(to) : '', missing: '' });
  }

  /** Sets the bar length to a standard one. */
  protected chooseBarLength(length: string): void {
    this.form.controls.barLength.setValue(length);
  }

  /** Opens the print dialog. */
  protected printSheet(): void {
    window.print();
  }
}
