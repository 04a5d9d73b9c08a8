import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { type FormControl, NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatOption } from '@angular/material/core';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatSelect } from '@angular/material/select';
import { type Subscription, distinctUntilChanged, skip, startWith } from 'rxjs';

import { isRollKind } from '../../../shared/forms/pins-rolls-form';
import type { LengthUnit } from '../../../shared/units/length-unit';
import { CalcPageLayout } from '../workbench/calc-page-layout';
import { CautionPanel } from '../workbench/caution-panel';
import { DerivationPanel } from '../workbench/derivation-panel';
import { controlMessage } from '../workbench/field-errors';
import { keepKnownChoice } from '../workbench/known-choice';
import { liveCalc } from '../workbench/live-calc';
import { bindQueryState } from '../workbench/query-state';
import { type ResultItem, ResultList } from '../workbench/result-list';
import { SaveSetup } from '../workbench/save-setup';
import { UnitToggle, convertLengthControls } from '../workbench/unit-toggle';
import { WarningList } from '../workbench/warning-list';
import { type DiscGiven, type DovetailSide, LENGTH_CONTROLS, PINS_DEFAULTS, type PinsOutcome, type PinsRollsForm, type RollKind, type RollMode, pinsCalc } from './pins-calc';
import { type RollDimensionTexts, RollDrawing, type RollSubject } from './roll-drawing';

export { PINS_DEFAULTS, pinsCalc };
export type { PinsRollsForm, RollKind, DovetailSide };

/** The kinds of measurement, in the order offered, with what each finds. */
export const ROLL_KINDS: readonly { value: RollKind; label: string; finds: string }[] = [
  { value: 'dovetail', label: 'Dovetail over rolls', finds: 'The reading over (or between) two rolls for a dovetail, or its width from a reading.' },
  { value: 'v-groove', label: 'Pin in a V-groove', finds: 'The height of a pin’s top over the surface, or the groove’s width from a reading.' },
  { value: 'dovetail-angle', label: 'Dovetail angle from two roll sizes', finds: 'The dovetail’s angle and corner width from readings over two sizes of roll.' },
  { value: 'taper-two-heights', label: 'Taper from readings at two heights', finds: 'A taper’s angle from readings over rolls on block stacks at two heights.' },
  { value: 'taper-discs', label: 'Taper set by two discs', finds: 'The taper per foot and angle two discs give, or their centre distance for a taper.' },
  { value: 'taper-balls', label: 'Internal taper with two balls', finds: 'A bore’s taper from the depths of a large and a small ball below its face.' },
];

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

/** A number typed in the form, or 0 when it is not one (the drawing only uses accepted values). */
function num(text: string): number {
  const n = Number(text);
  return Number.isFinite(n) ? n : 0;
}


/**
 * Empties the measured reading when the dovetail's side changes: a reading over male rolls means
 * nothing between female ones (and the other way round). Call in an injection context.
 */
function clearReadingOnSideChange(side: FormControl<DovetailSide>, reading: FormControl<string>): Subscription {
  return side.valueChanges.pipe(startWith(side.value), distinctUntilChanged(), skip(1), takeUntilDestroyed()).subscribe(() => {
    if (reading.value !== '') reading.reset('');
  });
}

/** The reading to stop at, shown large above the other results. */
export interface StopReading {
  /** What the number is ("Stop at x" …). */
  readonly label: string;
  /** The number with its unit. */
  readonly value: string;
  /** How to take it. */
  readonly note: string;
  /** What is left to cut, when worked back from a measured reading. */
  readonly left?: string;
}

/** The pins-and-rolls page: readings over rolls, pins, discs and balls, forward and back. */
@Component({
  selector: 'sw-pins-rolls-page',
  imports: [
    ReactiveFormsModule, MatFormField, MatLabel, MatHint, MatError, MatSuffix, MatInput, MatIcon, MatSelect, MatOption, MatButtonToggleGroup,
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
    ...PINS_DEFAULTS,
    unit: this.fb.control<LengthUnit>(PINS_DEFAULTS.unit),
    kind: this.fb.control<RollKind>(PINS_DEFAULTS.kind),
    mode: this.fb.control<RollMode>(PINS_DEFAULTS.mode),
    side: this.fb.control<DovetailSide>(PINS_DEFAULTS.side),
    discGiven: this.fb.control<DiscGiven>(PINS_DEFAULTS.discGiven),
    reference: this.fb.control<'axis' | 'side'>(PINS_DEFAULTS.reference),
  });
  protected readonly kinds = ROLL_KINDS;
  protected readonly cautions = ROLL_CAUTIONS;
  protected readonly query = bindQueryState(this.form, 'pins-rolls');
  private readonly kindGuard = keepKnownChoice(this.form.controls.kind, isRollKind, PINS_DEFAULTS.kind);
  private readonly sideGuard = clearReadingOnSideChange(this.form.controls.side, this.form.controls.reading);
  protected readonly calc = liveCalc<PinsRollsForm, PinsOutcome>(this.form, pinsCalc);
  protected readonly controlMessage = controlMessage;

  private readonly values = toSignal(this.form.valueChanges.pipe(startWith(null)), { initialValue: null });
  private readonly raw = computed(() => {
    this.values();
    return this.form.getRawValue() as PinsRollsForm;
  });
  /** The unit in use. */
  protected readonly unit = computed(() => this.raw().unit);
  /** What is measured. */
  protected readonly kind = computed(() => this.raw().kind);
  /** Toward a reading, or back from one. */
  protected readonly mode = computed(() => this.raw().mode);
  /** Male or female. */
  protected readonly side = computed(() => this.raw().side);
  /** Which disc figure is given. */
  protected readonly discGiven = computed(() => this.raw().discGiven);
  /** Whether the kind has a reverse mode. */
  protected readonly reversible = computed(() => this.kind() === 'dovetail' || this.kind() === 'v-groove');
  /** Whether the page works back from a measured reading. */
  protected readonly checking = computed(() => this.reversible() && this.mode() === 'check');
  /** One line on what the chosen kind finds. */
  protected readonly finds = computed(() => ROLL_KINDS.find((k) => k.value === this.kind())?.finds ?? '');
  /** The form values to save as a set-up. */
  protected readonly inputs = computed(() => this.raw() as unknown as Record<string, unknown>);
  /** A name to suggest when saving. */
  protected readonly suggestedName = computed(() => ROLL_KINDS.find((k) => k.value === this.kind())?.label ?? 'Pins & rolls');

  /** The answer, when it belongs to the kind on screen (the form may have moved on). */
  private readonly outcome = computed<PinsOutcome | null>(() => {
    const o = this.calc.value();
    return o && o.main.kind === this.calc.values().kind && o.main.kind === this.kind() ? o : null;
  });

  /** What the drawing shows, from the engine's accepted values. */
  protected readonly subject = computed<RollSubject | null>(() => {
    const o = this.outcome();
    if (!o) return null;
    const v = this.calc.values();
    const r = o.target ?? o.main;
    const val = r.values;
    switch (r.kind) {
      case 'v-groove':
        return { kind: 'v-groove', includedAngleDeg: num(val['includedAngleDeg']), pinDiameter: num(v.pinDiameter), grooveWidth: num(val['grooveWidth']) };
      case 'dovetail':
        return { kind: 'dovetail', side: v.side, angleDeg: num(val['angleDeg']), rollDiameter: num(v.rollDiameter), width: num(val['width']), depth: v.depth.trim() ? num(v.depth) : undefined };
      case 'dovetail-angle':
        return { kind: 'dovetail-angle', side: v.side, angleDeg: num(val['angleDeg']), rollDiameter1: num(v.rollDiameter1), rollDiameter2: num(v.rollDiameter2), width: num(val['width']) };
      case 'taper-two-heights':
        return { kind: 'taper-two-heights', measurement1: num(v.lowerReading), measurement2: num(v.upperReading), heightDifference: num(v.heightDifference) };
      case 'taper-discs':
        return { kind: 'taper-discs', largeDisc: num(v.largeDisc), smallDisc: num(v.smallDisc), centreDistance: num(val['centreDistance']), reference: v.reference };
      case 'taper-balls':
        return {
          kind: 'taper-balls', largeBall: num(v.largeBall), smallBall: num(v.smallBall), largeBallDepth: num(v.largeBallDepth), smallBallDepth: num(v.smallBallDepth),
          halfAngleDeg: num(val['halfAngleDeg']),
        };
    }
  });

  /** Dimension texts for the drawing. */
  protected readonly dimensionTexts = computed<RollDimensionTexts>(() => {
    const o = this.outcome();
    if (!o) return {};
    const v = this.calc.values();
    const r = o.main;
    const u = r.unit;
    const val = r.values;
    switch (r.kind) {
      case 'v-groove': {
        const stop = o.target ? `stop at ${o.target.values['measurement']} ${u}` : this.checking() ? `now ${val['measurement']} ${u}` : `stop at ${val['measurement']} ${u}`;
        return { measurement: stop, width: `W ${(o.target ?? r).values['grooveWidth']} ${u}` };
      }
      case 'dovetail': {
        const letter = v.side === 'male' ? 'x' : 'y';
        const stop = o.target
          ? `stop at ${letter} ${o.target.values['measurement']} ${u}`
          : this.checking() ? `${letter} ${val['measurement']} ${u} (measured)` : `stop at ${letter} ${val['measurement']} ${u}`;
        return {
          measurement: stop,
          width: `${v.side === 'male' ? 'a' : 'b'} ${(o.target ?? r).values['width']} ${u}`,
          depth: v.depth.trim() ? `h ${v.depth} ${u}` : undefined,
        };
      }
      case 'dovetail-angle': {
        const letter = v.side === 'male' ? 'x' : 'y';
        return {
          measurement: `${letter}₁ ${v.measurement1} ${u}`,
          measurement2: `${letter}₂ ${v.measurement2} ${u}`,
          width: `${v.side === 'male' ? 'a' : 'b'} ${val['width']} ${u}`,
        };
      }
      case 'taper-two-heights':
        return { measurement: `M₁ ${v.lowerReading} ${u}`, measurement2: `M₂ ${v.upperReading} ${u}`, height: `ΔH ${v.heightDifference} ${u}` };
      case 'taper-discs':
        return { large: `D ${v.largeDisc}`, small: `d ${v.smallDisc}`, centres: `C ${val['centreDistance']} ${u}` };
      case 'taper-balls':
        return {
          large: `Ø ${v.largeBall}`, small: `Ø ${v.smallBall}`, largeDepth: `h₁ ${v.largeBallDepth} ${u}`, smallDepth: `h₂ ${v.smallBallDepth} ${u}`,
        };
    }
  });

  /** The arc's text. */
  protected readonly angleText = computed(() => {
    const o = this.outcome();
    if (!o) return '';
    const r = o.main;
    switch (r.kind) {
      case 'v-groove':
        return `β ${trimDms(r.dms['includedAngleDeg'])}`;
      case 'dovetail':
      case 'dovetail-angle':
        return `α ${trimDms(r.dms['angleDeg'])}`;
      case 'taper-discs':
        return this.calc.values().reference === 'side' ? `α ${trimDms(r.dms['includedAngleDeg'])}` : `α/2 ${trimDms(r.dms['halfAngleDeg'] ?? '')}`;
      default:
        return `α/2 ${trimDms(r.dms['halfAngleDeg'])}`;
    }
  });

  /** The reading to stop at (dovetail and V-groove), shown large. */
  protected readonly stop = computed<StopReading | null>(() => {
    const o = this.outcome();
    if (!o || (o.main.kind !== 'dovetail' && o.main.kind !== 'v-groove')) return null;
    const u = o.main.unit;
    const v = this.calc.values();
    const dovetail = o.main.kind === 'dovetail';
    const male = v.side === 'male';
    const what = dovetail ? (male ? `over the ${v.rollDiameter} ${u} rolls` : `between the ${v.rollDiameter} ${u} rolls`) : `pin top over the surface, ${v.pinDiameter} ${u} pin`;
    const reading = o.target ?? (this.checking() ? null : o.main);
    if (!reading) return null;
    const left = o.left === undefined ? undefined : o.left.startsWith('-') ? `Already past the size by ${o.left.slice(1)} ${u}` : `${o.left} ${u} left to cut${dovetail ? ' on the width' : ' on the depth'}`;
    return {
      label: dovetail ? (male ? 'Stop at x' : 'Stop at y') : 'Stop at',
      value: `${reading.values['measurement']} ${u}`,
      note: `Reading ${what}`,
      left,
    };
  });

  /** The numbers to show. */
  protected readonly results = computed<ResultItem[]>(() => {
    const o = this.outcome();
    if (!o) return [];
    const r = o.main;
    const u = r.unit;
    const val = r.values;
    const v = this.calc.values();
    const items: ResultItem[] = [];
    const angle = (label: string, key: string, note?: string): ResultItem => ({ label, value: r.dms[key], unit: '', note: note ?? `${val[key]}°` });
    switch (r.kind) {
      case 'v-groove': {
        if (this.checking()) {
          items.push({ label: 'Groove width now', value: val['grooveWidth'], unit: u, emphasis: !o.target, note: 'At the sharp corners, from the measured pin height' });
          items.push({ label: 'Depth of the V now', value: val['apexDepth'], unit: u });
          if (o.left !== undefined) items.push({ label: 'Left to cut on the depth', value: o.left, unit: u, emphasis: true, note: 'The pin drops by as much as the V is deepened' });
          if (o.target) items.push({ label: 'Pin top at the drawing size', value: o.target.values['measurement'], unit: u });
          return items;
        }
        const m = val['measurement'];
        items.push(
          { label: 'Pin top over the surface', value: m, unit: u, emphasis: true, note: m.startsWith('-') ? 'Negative: the pin top sits below the surface' : 'Height of the pin’s top above the surface' },
          { label: 'Depth of the V to its point', value: val['apexDepth'], unit: u },
          { label: 'Groove width at the surface', value: val['grooveWidth'], unit: u },
        );
        return items;
      }
      case 'dovetail': {
        const male = v.side === 'male';
        if (this.checking()) {
          items.push({ label: male ? 'Corner width a now' : 'Corner width b now', value: val['width'], unit: u, emphasis: !o.target, note: 'At the sharp corners, from the measured reading' });
          if (o.left !== undefined) {
            items.push({ label: 'Left to cut on the width', value: o.left, unit: u, emphasis: true, note: 'Half of it on each flank if both flanks are still to cut (common practice)' });
          }
          if (o.target) items.push({ label: male ? 'Reading over the rolls at size' : 'Reading between the rolls at size', value: o.target.values['measurement'], unit: u });
        } else {
          items.push({
            label: male ? 'Reading over the rolls' : 'Reading between the rolls', value: val['measurement'], unit: u, emphasis: true,
            note: male ? 'Cut until the micrometer reads this over both rolls' : 'Cut until the rolls measure this apart',
          });
          items.push({ label: male ? 'Corner width a' : 'Corner width b', value: val['width'], unit: u });
        }
        const k = r.steps.find((s) => s.label === 'Roll constant');
        if (k) items.push({ label: 'Roll constant 1 + cot(α/2)', value: k.value, unit: '' });
        if (val['flankRun']) items.push({ label: 'Flank run over the depth', value: val['flankRun'], unit: u });
        if (val['contactHeight']) items.push({ label: 'Roll touches the flank at', value: val['contactHeight'], unit: u, note: 'Height above the base' });
        return items;
      }
      case 'dovetail-angle':
        return [
          { ...angle('Dovetail angle α', 'angleDeg'), emphasis: true },
          { label: v.side === 'male' ? 'Corner width a' : 'Corner width b', value: val['width'], unit: u, note: 'At the sharp corners' },
        ];
      case 'taper-two-heights':
      case 'taper-balls':
        items.push(
          // The two-height check says which way the work narrows: a note on the angle, not a warning.
          { ...angle('Included angle', 'includedAngleDeg', r.kind === 'taper-two-heights' ? `${val['includedAngleDeg']}° · ${o.warnings[0] ?? ''}` : undefined), emphasis: true },
          angle('Half angle (each side)', 'halfAngleDeg'),
          { label: 'Taper per foot', value: val['taperPerFoot'], unit: 'in/ft', note: 'On the diameter' },
        );
        if (r.kind === 'taper-balls') items.push({ label: 'Centre distance of the balls', value: val['centreDistance'], unit: u });
        return items;
      case 'taper-discs': {
        const side = v.reference === 'side';
        if (val['taperPerFoot']) items.push({ label: side ? 'Taper per foot (one side square)' : 'Taper per foot', value: val['taperPerFoot'], unit: 'in/ft', emphasis: true });
        items.push({ ...angle(side ? 'Angle between the sides' : 'Included angle', 'includedAngleDeg'), emphasis: !val['taperPerFoot'] });
        if (val['halfAngleDeg']) items.push(angle('Half angle', 'halfAngleDeg'));
        items.push({ label: 'Centre distance of the discs', value: val['centreDistance'], unit: u, emphasis: v.discGiven !== 'centreDistance', note: v.discGiven === 'centreDistance' ? 'As given' : 'Set the discs this far apart' });
        return items;
      }
    }
  });

  /** Warnings to show prominently (the two-height check's direction is a note on its angle instead). */
  protected readonly warnings = computed(() => {
    const o = this.outcome();
    return !o || o.main.kind === 'taper-two-heights' ? [] : o.warnings;
  });

  /** Messages that belong to no single field. */
  protected readonly problems = computed(() => this.calc.messages().general);

  /** Converts every entered length to the new unit and switches to it. */
  protected changeUnit(to: LengthUnit): void {
    convertLengthControls(this.form.controls, LENGTH_CONTROLS, this.form.controls.unit.value, to);
    this.form.controls.unit.setValue(to);
  }
}
