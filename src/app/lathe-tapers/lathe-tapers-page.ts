import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { type FormControl, type FormGroup, NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOptgroup, MatOption, MatSelect } from '@angular/material/select';
import { type Subscription, distinctUntilChanged, map, skip, startWith } from 'rxjs';

import { type LatheTaperResult, calculateLatheTaper } from '../../../shared/calc/lathe-taper';
import { fail, invalid, type CalcResult } from '../../../shared/calc/step';
import { MACHINE_TAPERS, type MachineTaper } from '../../../shared/data/machine-tapers';
import { Dec, fixedText } from '../../../shared/calc/decimal-math';
import { formatLength } from '../../../shared/units/length-unit';
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
import { UnitToggle, convertLengthControls, convertLengthText } from '../workbench/unit-toggle';
import { WarningList } from '../workbench/warning-list';
import { type LatheDimensionTexts, LatheWorkDrawing } from './lathe-work-drawing';
import type { LatheWorkInput } from './lathe-work-geometry';
import { type LatheTapersForm, type TaperDefinition, type TurningMethod, latheRequest, splitStations, standardHasSizes } from '../../../shared/forms/lathe-taper-form';

export { latheRequest, splitStations, type LatheTapersForm, type TaperDefinition, type TurningMethod } from '../../../shared/forms/lathe-taper-form';

const AREA = 'Lathe taper';

/** Default set-up: the arbor with a Morse No. 3 shank on an 8 in bar, turned with the compound. */
export const LATHE_DEFAULTS: LatheTapersForm = {
  unit: 'in',
  define: 'standard',
  standard: 'morse-3',
  taperPerFoot: '0.600',
  includedAngle: "3°",
  largeDiameter: '0.938',
  smallDiameter: '0.778',
  length: '3.1875',
  workLength: '8',
  method: 'compound',
  stations: '0.5, 1, 2',
};

/** Lengths converted when the unit changes (stations are converted item by item). */
const LENGTH_CONTROLS = ['largeDiameter', 'smallDiameter', 'length', 'workLength'] as const;

/** Family names for the taper picker's groups. */
const FAMILY_NAMES: Record<MachineTaper['family'], string> = {
  morse: 'Morse',
  'brown-sharpe': 'Brown & Sharpe',
  jarno: 'Jarno',
  steep: 'Steep (7:24)',
  'taper-pin': 'Taper pins',
  metric: 'Metric 1:20',
};

/** Runs the engine on the form's values; the offset method needs the work length. */
export function latheCalc(v: LatheTapersForm): CalcResult<LatheTaperResult> {
  // An empty definer would let the engine fall back to the diameters and name the wrong field.
  if (v.define === 'angle' && !v.includedAngle.trim()) return invalid(AREA, 'includedAngle', 'is required: type the included angle');
  if (v.define === 'tpf' && !v.taperPerFoot.trim()) return invalid(AREA, 'taperPerFoot', 'is required: type the taper per foot');
  // The engine checks every field first, then that one of the three sizes is left for it to find,
  // so a field's own error is never hidden behind the general one.
  const result = calculateLatheTaper(latheRequest(v));
  if (v.method !== 'offset' || v.workLength.trim()) return result;
  const workLength = 'is required for the tail-stock offset';
  return result.ok ? invalid(AREA, 'workLength', workLength) : fail(result.kind, AREA, { ...result.fields, workLength });
}

/**
 * Whether the form gives the taper itself and also all three sizes, which the taper and any two of
 * them would fix: a taper per foot, an included angle, or a standard that fixes only the taper.
 */
export function sizesOverGiven(v: LatheTapersForm): boolean {
  const taperGiven = v.define === 'tpf' || v.define === 'angle' || (v.define === 'standard' && !standardHasSizes(v.standard));
  return taperGiven && [v.largeDiameter, v.smallDiameter, v.length].every((x) => x.trim() !== '');
}

/**
 * Opens a way of giving the taper ready to answer: when the taper and all three sizes would be
 * given (the Morse No. 3 sizes kept from the standard), the small diameter is emptied for the
 * taper to work out. Runs now and whenever the way or the standard changes. Call in an injection
 * context, before the page's first calculation.
 */
function openComputable(form: FormGroup<{ [K in keyof LatheTapersForm]: FormControl<LatheTapersForm[K]> }>): Subscription {
  const tidy = () => {
    if (sizesOverGiven(form.getRawValue())) form.controls.smallDiameter.reset('');
  };
  tidy();
  const way = () => `${form.controls.define.value} ${form.controls.standard.value}`;
  return form.valueChanges.pipe(map(way), startWith(way()), distinctUntilChanged(), skip(1), takeUntilDestroyed()).subscribe(tidy);
}

/** The lathe-taper page: taper per foot, angles, tail-stock offset and diameters along the taper. */
@Component({
  selector: 'sw-lathe-tapers-page',
  imports: [
    ReactiveFormsModule, MatFormField, MatLabel, MatHint, MatError, MatSuffix, MatInput, MatSelect, MatOption, MatOptgroup, MatIcon,
    MatButtonToggleGroup, MatButtonToggle, CalcPageLayout, LatheWorkDrawing, ResultList, WarningList, DerivationPanel,
    CautionPanel, SaveSetup, UnitToggle,
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './lathe-tapers-page.html',
  styleUrl: './lathe-tapers-page.scss',
})
export default class LatheTapersPage {
  private readonly fb = inject(NonNullableFormBuilder);

  /** The inputs, as typed. */
  protected readonly form = this.fb.group({
    unit: this.fb.control<LengthUnit>(LATHE_DEFAULTS.unit),
    define: this.fb.control<TaperDefinition>(LATHE_DEFAULTS.define),
    standard: LATHE_DEFAULTS.standard,
    taperPerFoot: LATHE_DEFAULTS.taperPerFoot,
    includedAngle: LATHE_DEFAULTS.includedAngle,
    largeDiameter: LATHE_DEFAULTS.largeDiameter,
    smallDiameter: LATHE_DEFAULTS.smallDiameter,
    length: LATHE_DEFAULTS.length,
    workLength: LATHE_DEFAULTS.workLength,
    method: this.fb.control<TurningMethod>(LATHE_DEFAULTS.method),
    stations: LATHE_DEFAULTS.stations,
  });
  /** Standard tapers, grouped by family. */
  protected readonly families = Object.entries(FAMILY_NAMES).map(([family, name]) => ({
    name,
    tapers: MACHINE_TAPERS.filter((t) => t.family === family),
  }));
  protected readonly query = bindQueryState(this.form, 'lathe-taper');
  // A choice no page offers (a mistyped address: ?define=foo) goes back to the default.
  private readonly knownDefine = keepKnownChoice(this.form.controls.define, (v) => ['standard', 'tpf', 'angle', 'diameters'].includes(v as string), LATHE_DEFAULTS.define);
  private readonly knownMethod = keepKnownChoice(this.form.controls.method, (v) => v === 'compound' || v === 'offset', LATHE_DEFAULTS.method);
  private readonly computable = openComputable(this.form);
  protected readonly calc = liveCalc<LatheTapersForm, LatheTaperResult>(this.form, latheCalc);
  protected readonly controlMessage = controlMessage;

  private readonly values = toSignal(this.form.valueChanges.pipe(startWith(null)), { initialValue: null });
  private readonly raw = computed(() => {
    this.values();
    return this.form.getRawValue();
  });
  /** The unit in use. */
  protected readonly unit = computed(() => this.raw().unit);
  /** How the taper is given. */
  protected readonly define = computed(() => this.raw().define);
  /** A standard that fixes only the taper (7:24, taper pin): the part's sizes are asked for. */
  protected readonly unsizedStandard = computed(() => this.raw().define === 'standard' && !standardHasSizes(this.raw().standard));
  /** The form values to save as a set-up. */
  protected readonly inputs = computed(() => this.raw() as unknown as Record<string, unknown>);

  /** What the drawing shows: the user's taper, or a 1-unit bar when no diameter is known. */
  protected readonly work = computed<{ input: LatheWorkInput; nominal: boolean } | null>(() => {
    const r = this.calc.value();
    if (!r) return null;
    const k = Number(r.taperPerInch);
    const method = this.raw().method;
    // The values the answer was worked from, not the form's latest text: between a keystroke and
    // the recompute the field may hold text that is not a number yet.
    const worked = Number(this.calc.values().workLength);
    const L = r.tailstockOffset !== null && Number.isFinite(worked) && worked > 0 ? worked : undefined;
    const offset = r.tailstockOffset !== null ? Number(r.tailstockOffset) : undefined;
    if (r.largeDiameter !== null && r.smallDiameter !== null && r.length !== null) {
      return {
        input: { largeDiameter: Number(r.largeDiameter), smallDiameter: Number(r.smallDiameter), taperLength: Number(r.length), workLength: L, method, offset },
        nominal: false,
      };
    }
    // Only the taper is known: draw a bar 1 across with the taper over 3, from the same taper per inch.
    const D = 1;
    const l = 3;
    return { input: { largeDiameter: D, smallDiameter: Math.max(D - k * l, 0.05), taperLength: l, workLength: L, method, offset }, nominal: true };
  });

  /** Dimension texts for the drawing. */
  protected readonly dimensionTexts = computed<LatheDimensionTexts>(() => {
    const r = this.calc.value();
    const w = this.work();
    if (!r || !w) return {};
    const u = r.unit;
    const texts: LatheDimensionTexts = {};
    if (!w.nominal) {
      texts.large = `Ø ${r.largeDiameter} ${u}`;
      texts.small = `Ø ${r.smallDiameter} ${u}`;
      texts.taper = `${r.length} ${u}`;
    }
    if (r.tailstockOffset !== null) texts.work = `L ${this.calc.values().workLength} ${u}`;
    if (r.tailstockOffset !== null && this.raw().method === 'offset') texts.offset = `offset ${r.tailstockOffset} ${u}`;
    return texts;
  });

  /** The arc's text: the half angle for the compound, the offset's tilt otherwise. */
  protected readonly angleText = computed(() => {
    const r = this.calc.value();
    if (!r) return '';
    return this.raw().method === 'compound' ? `α/2 = ${r.halfAngleDms}` : `tilt ≈ α/2 = ${r.halfAngleDms}`;
  });

  /** The numbers to show. */
  protected readonly results = computed<ResultItem[]>(() => {
    const r = this.calc.value();
    if (!r) return [];
    const u = r.unit;
    const compound = this.raw().method === 'compound';
    const items: ResultItem[] = [];
    const half: ResultItem = {
      label: 'Half angle (compound setting)', value: r.halfAngleDms, unit: '', note: `${r.halfAngleDeg}° from the lathe axis`, emphasis: compound,
    };
    if (r.tailstockOffset !== null) {
      // The work length as the unit shows lengths (".5" → "0.5000"), or as typed while it is not a number yet.
      const typed = this.calc.values().workLength.trim();
      const work = /^(\d+\.?\d*|\.\d+)$/.test(typed) ? formatLength(new Dec(typed), r.unit) : typed;
      const offset: ResultItem = {
        label: 'Tail-stock offset', value: r.tailstockOffset, unit: u, note: `For ${work} ${u} between centres`, emphasis: !compound,
      };
      items.push(...(compound ? [half, offset] : [offset, half]));
    } else {
      items.push(half);
    }
    if (u === 'mm') {
      // A metric drawing gives the taper as a ratio 1:x; per foot means nothing on a metric job.
      const per100 = fixedText(new Dec(r.exact.taperPerFoot).div(12).mul(100), 4);
      items.push(
        { label: 'Taper ratio', value: r.ratio, unit: '', note: 'Diameter change 1 over a length of x' },
        { label: 'Taper per mm of length', value: r.taperPerInch, unit: 'mm/mm', note: `${per100} mm on the diameter per 100 mm of length` },
      );
    } else {
      items.push(
        { label: 'Taper per foot', value: r.taperPerFoot, unit: 'in/ft' },
        { label: 'Taper per inch', value: r.taperPerInch, unit: 'in/in' },
        { label: 'Ratio', value: r.ratio, unit: '' },
      );
    }
    items.push({ label: 'Included angle', value: r.includedAngleDms, unit: '', note: `${r.includedAngleDeg}°` });
    if (r.largeDiameter !== null) items.push({ label: 'Large diameter', value: r.largeDiameter, unit: u });
    if (r.smallDiameter !== null) items.push({ label: 'Small diameter', value: r.smallDiameter, unit: u });
    if (r.length !== null) items.push({ label: 'Taper length', value: r.length, unit: u });
    for (const s of r.stations) items.push({ label: `Ø at ${s.distance} ${u} from the large end`, value: s.diameter, unit: u });
    return items;
  });

  /** Messages that belong to no single field. */
  protected readonly problems = computed(() => this.calc.messages().general);

  /** Converts every entered length to the new unit and switches to it. */
  protected changeUnit(to: LengthUnit): void {
    const from = this.form.controls.unit.value;
    convertLengthControls(this.form.controls, LENGTH_CONTROLS, from, to);
    const stations = splitStations(this.form.controls.stations.value).map((s) => convertLengthText(s, from, to));
    this.form.controls.stations.setValue(stations.join(', '), { emitEvent: false });
    this.form.controls.unit.setValue(to);
  }
}
