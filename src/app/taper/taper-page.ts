import { ChangeDetectionStrategy, Component, computed, effect, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatSelect, MatOption } from '@angular/material/select';

import { positiveLength } from '../../../shared/api/calc';
import { Dec } from '../../../shared/calc/decimal-math';
import { type CalcResult, fail, invalid, succeed } from '../../../shared/calc/step';
import { MILLING_CAUTIONS, calculateTaper, type TaperResult } from '../../../shared/calc/taper';
import { GAUGE_BLOCK_SETS } from '../../../shared/data/gauge-sets';
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
import { TaperDrawing } from './taper-drawing';
import { ANGLE_SET_OPTIONS, HOLDING_OPTIONS, type HoldingPlan, holdingKind, planHolding } from '../../../shared/forms/taper-holding';
import {
  CHAMFER_GIVEN_OPTIONS, TAPER_DEFAULTS, TAPER_GIVEN_OPTIONS, TAPER_LENGTH_FIELDS, type TaperFormValues, givenFields, taperResultItems,
  taperSceneInput, toTaperRequest,
} from './taper-form';

/** A taper answer with the set-up for the chosen work-holding. */
export type TaperOutcome = TaperResult & { readonly holding: HoldingPlan };

/** The taper engine, then the set-up for the holding (whose inputs fail on their own controls). */
export function runTaper(values: TaperFormValues): CalcResult<TaperOutcome> {
  // The two sizes the choice of "Defined by" uses are both needed: an empty one is named on its box
  // (a newly shown box starts empty), not as the engine's count of what was given.
  const use = givenFields(values.given);
  const needed: Array<[keyof TaperFormValues, boolean, string]> = [
    ['angle', use.angle, 'the taper angle, e.g. 7°30\''],
    ['taperLength', use.taperLength, 'the taper length'],
    ['endThickness', use.end, values.shape === 'chamfer' ? 'the leg on the end face' : 'the end thickness'],
    ['faceLength', use.faceLength, 'the face length'],
  ];
  const empty = needed.find(([name, used]) => used && values[name].trim() === '');
  if (empty) return invalid('Taper', empty[0], `is required: type ${empty[2]}`);
  const taper = calculateTaper(toTaperRequest(values));
  if (!taper.ok) return taper;
  // The part length only sizes the drawing, but a typo in it still gets its own message, and a
  // taper longer than the part is said.
  const warnings = [...taper.value.warnings];
  if (values.partLength.trim() !== '') {
    const part = positiveLength.safeParse(values.partLength);
    if (!part.success) return fail('invalid', 'Taper', { partLength: part.error.issues[0]?.message ?? 'must be a length' });
    const along = values.shape === 'chamfer' ? 'leg on the top face' : 'taper length';
    if (new Dec(taper.value.taperLength).gt(part.data)) warnings.push(`The ${along} (${taper.value.taperLength} ${taper.value.unit}) is longer than the part (${values.partLength.trim()} ${taper.value.unit}): check both against the drawing.`);
  }
  const holding = planHolding(values, taper.value);
  if (!holding.ok) return holding;
  return succeed({ ...taper.value, warnings, holding: holding.value });
}

/** Taper planner (mill): the depth to stop, end thickness, face length and passes, drawn on the set-up. */
@Component({
  selector: 'sw-taper-page',
  imports: [
    ReactiveFormsModule, MatFormFieldModule, MatInput, MatSelect, MatOption, MatButton, MatIconButton, MatIcon,
    CalcPageLayout, CautionPanel, DerivationPanel, ResultList, SaveSetup, UnitToggle, WarningList, TaperDrawing,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './taper-page.html',
  styleUrl: './taper-page.scss',
})
export default class TaperPage {
  /** The inputs, as typed; the engine reads them through the shared schema. */
  protected readonly form = inject(NonNullableFormBuilder).group({ ...TAPER_DEFAULTS });
  /** The URL query and `?setup=` kept in step with the form. */
  protected readonly query = bindQueryState(this.form, 'taper');
  /** The engine's answer, recomputed in the browser after each pause in typing. */
  protected readonly calc = liveCalc<TaperFormValues, TaperOutcome>(this.form, runTaper, {
    aliases: { removedAtEnd: 'endThickness' },
  });
  /** Which pass the drawing shows (0: the whole cut). */
  protected readonly selectedPass = signal(0);
  /** The last answer there was, so a switch of "Defined by" can carry its sizes into the new boxes. */
  private lastAnswer: TaperOutcome | null = null;
  private readonly keepsAnswer = effect(() => {
    const r = this.calc.value();
    if (r) this.lastAnswer = r;
  });
  private readonly carriesSizes = this.form.controls.given.valueChanges.pipe(takeUntilDestroyed()).subscribe((given) => {
    // The part is the same; only what is typed changes: a newly shown, empty box gets the size the
    // last answer worked out (the end size as the chamfer's leg for a chamfer).
    const r = this.lastAnswer;
    if (!r) return;
    const use = givenFields(given);
    const sizes: Array<[keyof TaperFormValues, boolean, string]> = [
      ['angle', use.angle, r.angleDms],
      ['taperLength', use.taperLength, r.taperLength],
      ['endThickness', use.end, (this.form.controls.shape.value === 'chamfer' ? r.removedAtEnd : r.endThickness) ?? ''],
      ['faceLength', use.faceLength, r.faceLength],
    ];
    for (const [name, used, value] of sizes) {
      const control = this.form.controls[name];
      if (used && control.value.trim() === '' && value) control.setValue(value);
    }
  });

  protected readonly givenOptions = computed(() => (this.chamfer() ? CHAMFER_GIVEN_OPTIONS : TAPER_GIVEN_OPTIONS));
  protected readonly holdingOptions = HOLDING_OPTIONS;
  protected readonly angleSets = ANGLE_SET_OPTIONS;
  protected readonly cautions = MILLING_CAUTIONS;
  protected readonly controlMessage = controlMessage;

  private readonly unitValue = toSignal(this.form.controls.unit.valueChanges, { initialValue: this.form.controls.unit.value });
  private readonly givenValue = toSignal(this.form.controls.given.valueChanges, { initialValue: this.form.controls.given.value });
  private readonly shapeValue = toSignal(this.form.controls.shape.valueChanges, { initialValue: this.form.controls.shape.value });
  private readonly holdingValue = toSignal(this.form.controls.holding.valueChanges, { initialValue: this.form.controls.holding.value });

  /** The work-holding chosen. */
  protected readonly holding = computed(() => holdingKind(this.holdingValue()));
  /** Gauge-block sets in the unit in use, for the sine plate's stack. */
  protected readonly plateSets = computed(() => GAUGE_BLOCK_SETS.filter((g) => g.unit === this.unit()).map((g) => ({ id: g.id, name: g.name })));

  /** The unit in use. */
  protected readonly unit = computed<LengthUnit>(() => (this.unitValue() === 'mm' ? 'mm' : 'in'));
  /** Which of the four sizes are asked for. */
  protected readonly uses = computed(() => givenFields(this.givenValue()));
  /** Whether the feature is a chamfer (the end size is then the leg on the end). */
  protected readonly chamfer = computed(() => this.shapeValue() === 'chamfer');
  /** The pass shown, kept within the passes there are. */
  protected readonly shownPass = computed(() => Math.min(this.selectedPass(), this.calc.value()?.passes.length ?? 0));
  /** The result list. */
  protected readonly items = computed(() => {
    const r = this.calc.value();
    return r ? taperResultItems(r) : [];
  });
  /** The drawing's model. */
  protected readonly scene = computed(() => {
    const r = this.calc.value();
    return r ? taperSceneInput(r, this.calc.values(), this.shownPass(), r.holding.drawing) : null;
  });
  /** The shown pass's numbers, for the line under the drawing. */
  protected readonly shownPassInfo = computed(() => {
    const r = this.calc.value();
    const k = this.shownPass();
    return r && k > 0 ? r.passes[k - 1] : null;
  });
  /** A name to start the save dialog with. */
  protected readonly suggestedName = computed(() => {
    const v = this.calc.values();
    return `Taper ${v.angle} on ${v.thickness} ${v.unit} stock`;
  });

  /** Converts the entered lengths and switches the unit. */
  protected changeUnit(to: LengthUnit): void {
    convertLengthControls(this.form.controls, TAPER_LENGTH_FIELDS, this.unit(), to);
    const plateSet = this.form.controls.plateSet.value ? (GAUGE_BLOCK_SETS.find((g) => g.unit === to)?.id ?? '') : '';
    this.form.patchValue({ unit: to, plateSet });
  }

  /** Shows one pass on the drawing (0: the whole cut). */
  protected showPass(pass: number): void {
    const count = this.calc.value()?.passes.length ?? 0;
    this.selectedPass.set(Math.max(0, Math.min(count, pass)));
  }

  /** Opens the browser's print dialog (the print layout is one sheet). */
  protected printSheet(): void {
    window.print();
  }
}
