import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { startWith } from 'rxjs';

import { type OverPinsResult, calculateOverPins } from '../../../shared/calc/over-pins';
import type { CalcResult } from '../../../shared/calc/step';
import type { LengthUnit } from '../../../shared/units/length-unit';
import { CalcPageLayout } from '../workbench/calc-page-layout';
import { CautionPanel } from '../workbench/caution-panel';
import { DerivationPanel } from '../workbench/derivation-panel';
import { controlMessage } from '../workbench/field-errors';
import { liveCalc } from '../workbench/live-calc';
import { bindQueryState } from '../workbench/query-state';
import { type ResultItem, ResultList } from '../workbench/result-list';
import { SaveSetup } from '../workbench/save-setup';
import { UnitToggle, convertLengthControls } from '../workbench/unit-toggle';
import { WarningList } from '../workbench/warning-list';
import { type RollDimensionTexts, RollDrawing, type RollSubject } from './roll-drawing';

/** What is measured. */
export type RollKind = 'dovetail' | 'v-groove';
/** Which side of a dovetail. */
export type DovetailSide = 'male' | 'female';

/** The form's values, all as typed. */
export interface PinsRollsForm {
  unit: LengthUnit;
  kind: RollKind;
  side: DovetailSide;
  /** Dovetail angle between flank and base. */
  angle: string;
  rollDiameter: string;
  /** Sharp-corner width at the roll side (a or b). */
  width: string;
  depth: string;
  /** Included angle of the V. */
  includedAngle: string;
  pinDiameter: string;
  grooveWidth: string;
}

/** Default set-up: the 60° dovetail slide checked over 0.375 in rolls. */
export const PINS_DEFAULTS: PinsRollsForm = {
  unit: 'in',
  kind: 'dovetail',
  side: 'male',
  angle: '60',
  rollDiameter: '0.375',
  width: '1.250',
  depth: '0.375',
  includedAngle: '90',
  pinDiameter: '0.500',
  grooveWidth: '1.000',
};

const LENGTH_CONTROLS = ['rollDiameter', 'width', 'depth', 'pinDiameter', 'grooveWidth'] as const;

/** Cautions for cutting to a reading over rolls (REFERENCE.md §7). */
export const ROLL_CAUTIONS: readonly string[] = [
  'Measure over the rolls only with the spindle and work stopped (Michigan Admin. Code R 408.12640 "Milling"; US Army TM 1-1500-204-23-8).',
  'Deburr the corners before measuring: a burr under a roll gives a false reading; keep the work clean and free of chips (US Army TM 1-1500-204-23-8).',
  'Secure the work before the table moves toward the cutter, and take light finishing cuts as you approach the reading (Michigan Admin. Code R 408.12640 "Milling").',
];

/** Drops zero minutes and seconds from DMS text: 60°00'00" → 60°, 55°30'00" → 55°30'. */
export function trimDms(text: string): string {
  return text.replace(/00"$/, '').replace(/°00'$/, '°');
}

/** Runs the engine on the form's values, sending only the fields of the chosen kind. */
export function pinsCalc(v: PinsRollsForm): CalcResult<OverPinsResult> {
  if (v.kind === 'v-groove') {
    return calculateOverPins({ kind: 'v-groove', unit: v.unit, includedAngle: v.includedAngle, pinDiameter: v.pinDiameter, grooveWidth: v.grooveWidth });
  }
  return calculateOverPins({ kind: 'dovetail', unit: v.unit, side: v.side, angle: v.angle, rollDiameter: v.rollDiameter, width: v.width, depth: v.depth });
}

/** The pins-and-rolls page: the reading over rolls for a dovetail, or over a pin in a V-groove. */
@Component({
  selector: 'sw-pins-rolls-page',
  imports: [
    ReactiveFormsModule, MatFormField, MatLabel, MatHint, MatError, MatSuffix, MatInput, MatIcon, MatButtonToggleGroup,
    MatButtonToggle, CalcPageLayout, RollDrawing, ResultList, WarningList, DerivationPanel, CautionPanel, SaveSetup, UnitToggle,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './pins-rolls-page.html',
  styleUrl: './pins-rolls-page.scss',
})
export default class PinsRollsPage {
  private readonly fb = inject(NonNullableFormBuilder);

  /** The inputs, as typed. */
  protected readonly form = this.fb.group({
    unit: this.fb.control<LengthUnit>(PINS_DEFAULTS.unit),
    kind: this.fb.control<RollKind>(PINS_DEFAULTS.kind),
    side: this.fb.control<DovetailSide>(PINS_DEFAULTS.side),
    angle: PINS_DEFAULTS.angle,
    rollDiameter: PINS_DEFAULTS.rollDiameter,
    width: PINS_DEFAULTS.width,
    depth: PINS_DEFAULTS.depth,
    includedAngle: PINS_DEFAULTS.includedAngle,
    pinDiameter: PINS_DEFAULTS.pinDiameter,
    grooveWidth: PINS_DEFAULTS.grooveWidth,
  });
  protected readonly cautions = ROLL_CAUTIONS;
  protected readonly query = bindQueryState(this.form, 'pins-rolls');
  protected readonly calc = liveCalc<PinsRollsForm, OverPinsResult>(this.form, pinsCalc);
  protected readonly controlMessage = controlMessage;

  private readonly values = toSignal(this.form.valueChanges.pipe(startWith(null)), { initialValue: null });
  private readonly raw = computed(() => {
    this.values();
    return this.form.getRawValue();
  });
  /** The unit in use. */
  protected readonly unit = computed(() => this.raw().unit);
  /** Dovetail or V-groove. */
  protected readonly kind = computed(() => this.raw().kind);
  /** Male or female. */
  protected readonly side = computed(() => this.raw().side);
  /** The form values to save as a set-up. */
  protected readonly inputs = computed(() => this.raw() as unknown as Record<string, unknown>);

  /** What the drawing shows, from the engine's accepted values. */
  protected readonly subject = computed<RollSubject | null>(() => {
    const r = this.calc.value();
    const v = this.raw();
    if (!r || r.kind !== v.kind) return null;
    if (r.kind === 'v-groove') {
      return { kind: 'v-groove', includedAngleDeg: Number(r.values['includedAngleDeg']), pinDiameter: Number(v.pinDiameter), grooveWidth: Number(r.values['grooveWidth']) };
    }
    return {
      kind: 'dovetail',
      side: v.side,
      angleDeg: Number(r.values['angleDeg']),
      rollDiameter: Number(v.rollDiameter),
      width: Number(r.values['width']),
      depth: v.depth.trim() ? Number(v.depth) : undefined,
    };
  });

  /** Dimension texts for the drawing. */
  protected readonly dimensionTexts = computed<RollDimensionTexts>(() => {
    const r = this.calc.value();
    const v = this.raw();
    if (!r) return {};
    const u = r.unit;
    if (r.kind === 'v-groove') {
      return { measurement: `${r.values['measurement']} ${u}`, width: `W ${r.values['grooveWidth']} ${u}` };
    }
    return {
      measurement: `${v.side === 'male' ? 'x' : 'y'} ${r.values['measurement']} ${u}`,
      width: `${v.side === 'male' ? 'a' : 'b'} ${r.values['width']} ${u}`,
      depth: v.depth.trim() ? `h ${v.depth} ${u}` : undefined,
    };
  });

  /** The arc's text. */
  protected readonly angleText = computed(() => {
    const r = this.calc.value();
    if (!r) return '';
    return r.kind === 'v-groove' ? `β ${trimDms(r.dms['includedAngleDeg'])}` : `α ${trimDms(r.dms['angleDeg'])}`;
  });

  /** The numbers to show. */
  protected readonly results = computed<ResultItem[]>(() => {
    const r = this.calc.value();
    if (!r) return [];
    const u = r.unit;
    const val = r.values;
    if (r.kind === 'v-groove') {
      const m = val['measurement'];
      const below = m.startsWith('-');
      return [
        {
          label: 'Pin top over the surface', value: m, unit: u, emphasis: true,
          note: below ? 'Negative: the pin top sits below the surface' : 'Height of the pin’s top above the surface',
        },
        { label: 'Depth of the V to its point', value: val['apexDepth'], unit: u },
        { label: 'Groove width at the surface', value: val['grooveWidth'], unit: u },
      ];
    }
    const male = this.raw().side === 'male';
    const items: ResultItem[] = [
      {
        label: male ? 'Reading over the rolls' : 'Reading between the rolls', value: val['measurement'], unit: u, emphasis: true,
        note: male ? 'Cut until the micrometer reads this over both rolls' : 'Cut until the rolls measure this apart',
      },
      { label: male ? 'Corner width a' : 'Corner width b', value: val['width'], unit: u },
    ];
    const k = r.steps.find((s) => s.label === 'Roll constant');
    if (k) items.push({ label: 'Roll constant 1 + cot(α/2)', value: k.value, unit: '' });
    if (val['flankRun']) items.push({ label: 'Flank run over the depth', value: val['flankRun'], unit: u });
    if (val['contactHeight']) items.push({ label: 'Roll touches the flank at', value: val['contactHeight'], unit: u, note: 'Height above the base' });
    return items;
  });

  /** Messages that belong to no single field. */
  protected readonly problems = computed(() => this.calc.messages().general);

  /** Converts every entered length to the new unit and switches to it. */
  protected changeUnit(to: LengthUnit): void {
    convertLengthControls(this.form.controls, LENGTH_CONTROLS, this.form.controls.unit.value, to);
    this.form.controls.unit.setValue(to);
  }
}
