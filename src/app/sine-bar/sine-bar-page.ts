import { ChangeDetectionStrategy, Component, computed, effect, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';

import { SINE_BAR_CAUTIONS, type SineBarResult, calculateSineBar, compoundStackBlocks, unmakeableRows, unmakeableStack } from '../../../shared/calc/sine-bar';
import { type TeamBox, boxStackBlocks, teamBoxOf, teamGaugeBox } from '../../../shared/library/team-boxes';
import type { LengthUnit } from '../../../shared/units/length-unit';
import { type BoxStackQuery, bindOwnBoxes, boxIdOf, boxStackState, excludedNote } from '../gauge-blocks/own-boxes';
import { InventoryApi } from '../inventory/inventory-api';
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
  BAR_LENGTHS, SINE_BAR_DEFAULTS, SINE_BAR_LENGTH_FIELDS, type SineBarFormValues, complementStackText, defaultSet, setsInUnit, sineBarSceneInput,
  toSineBarRequest,
} from './sine-bar-form';
import {
  SINE_BAR_ALIASES, SINE_BAR_MODES, type SineBarOutcome, compoundAxisScene, outcomeItems, runSineBar, sineBarMode, tableRowScene,
} from './sine-bar-modes';

/** Sine bar & plate: the stack for an angle or the angle of a stack, with the blocks drawn under the roll. */
@Component({
  selector: 'sw-sine-bar-page',
  imports: [
    ReactiveFormsModule, MatFormFieldModule, MatInput, MatSelect, MatOption, MatButton, MatButtonToggleGroup, MatButtonToggle, MatIcon, MatTableModule,
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
  /**
   * The engine's answer, recomputed in the browser. With the team's own box the engine works
   * without a set (stack rounded to the unit's step) and the blocks come from the inventory route.
   */
  protected readonly calc = liveCalc<SineBarFormValues, SineBarOutcome>(this.form, (v) => runSineBar(boxIdOf(v.set) === null ? v : { ...v, set: '', missing: '' }), {
    aliases: SINE_BAR_ALIASES,
  });
  /** The table row shown in the drawing (index into the rows). */
  protected readonly selectedRow = signal(0);

  protected readonly modes = SINE_BAR_MODES;
  /** Columns of the table of stacks. */
  protected readonly tableColumns = ['angle', 'stack', 'blocks', 'count', 'achieved', 'error'] as const;

  protected readonly cautions = SINE_BAR_CAUTIONS;
  protected readonly controlMessage = controlMessage;

  private readonly unitValue = toSignal(this.form.controls.unit.valueChanges, { initialValue: this.form.controls.unit.value });
  private readonly modeValue = toSignal(this.form.controls.mode.valueChanges, { initialValue: this.form.controls.mode.value });
  private readonly compoundByValue = toSignal(this.form.controls.compoundBy.valueChanges, { initialValue: this.form.controls.compoundBy.value });
  private readonly setValue = toSignal(this.form.controls.set.valueChanges, { initialValue: this.form.controls.set.value });

  /** The unit in use. */
  protected readonly unit = computed<LengthUnit>(() => (this.unitValue() === 'mm' ? 'mm' : 'in'));
  /** The mode chosen on the form. */
  protected readonly mode = computed(() => sineBarMode(this.modeValue()));
  /** Whether a compound plate is set from two angles (otherwise two stacks give the angles). */
  protected readonly compoundByAngles = computed(() => this.compoundByValue() !== 'stacks');
  /** The engine's single-setting answer, before any blocks from the team's box. */
  private readonly engineSingle = computed(() => {
    const o = this.calc.value();
    return o && (o.mode === 'angle' || o.mode === 'stack') ? o.single : null;
  });
  /** The signed-in team's gauge-block sets (none for a visitor). */
  /** Set when a box named by the link or set-up could not be used. */
  protected readonly replacedBox = signal<string | null>(null);
  private readonly boxes = bindOwnBoxes(this.form.controls.set, this.unit, defaultSet, this.replacedBox);
  /** The team's set chosen, or null. */
  protected readonly ownBox = computed(() => this.boxes().find((b) => b.value === this.setValue()) ?? null);
  /** The blocks of the stack height from the team's box, asked of the inventory route (no wear blocks under a roll). */
  private readonly boxState = boxStackState(
    computed<BoxStackQuery | null>(() => {
      const box = this.ownBox();
      const r = this.engineSingle();
      return box && r && Number(r.stackHeight) > 0 ? { setId: box.id, target: r.stackHeight, wear: false } : null;
    }),
  );
  /** The single-setting answer (stack for an angle or angle from a stack), with the box's blocks for an own box; or null. */
  protected readonly single = computed<SineBarResult | null>(() => {
    const r = this.engineSingle();
    if (!r || !this.ownBox()) return r;
    if (Number(r.stackHeight) === 0) return { ...r, blocks: [], blockCount: 0 };
    const st = this.boxState();
    const blocks = st.status === 'done' && st.query.target === r.stackHeight ? st.answer.blocks : null;
    return { ...r, blocks, blockCount: blocks ? blocks.length : null };
  });
  /** Why the box gives no blocks for the stack, or the blocks it leaves out. */
  protected readonly boxNotes = computed(() => {
    const box = this.ownBox();
    if (!box) return null;
    const st = this.boxState();
    const gone = st.status === 'done' ? st.answer.excluded : st.status === 'failed' ? st.excluded : [];
    return {
      name: box.name,
      problem: st.status === 'failed' ? (st.field === 'target' ? unmakeableStack(st.query.target, this.unit(), this.mode() === 'angle') : st.message) : null,
      asking: st.status === 'loading',
      leftOut: excludedNote(gone, this.unit()),
    };
  });
  private readonly inventory = inject(InventoryApi);
  /**
   * The chosen team box with what is in it, for the table, the compound plate and a steep angle's
   * complement: they need many stacks at once (or one more), so their blocks are picked here from
   * the box (as the server would pick them).
   */
  private readonly loadedBox = signal<TeamBox | null>(null);
  private readonly loadsBox = effect(() => {
    const id = boxIdOf(this.setValue());
    const mode = sineBarMode(this.modeValue());
    const steep = mode === 'angle' && Number(this.engineSingle()?.angleDeg) > 45;
    if (id === null || (mode !== 'table' && mode !== 'compound' && !steep) || this.loadedBox()?.id === id) return;
    this.inventory.get('gauge-blocks', id, true).subscribe({ next: (set) => this.loadedBox.set(teamBoxOf(set)), error: () => this.loadedBox.set(null) });
  });
  /** The loaded box when it is the one chosen, else null. */
  private readonly chosenBox = computed(() => {
    const box = this.loadedBox();
    return box && box.id === boxIdOf(this.setValue()) ? box : null;
  });
  /** The table of stacks, or null; with the team's box, each row's blocks from it. */
  protected readonly table = computed(() => {
    const o = this.calc.value();
    if (o?.mode !== 'table') return null;
    if (!this.ownBox()) return o.table;
    const box = this.chosenBox();
    const rows = o.table.rows.map((row) => {
      const blocks = box ? boxStackBlocks(box, row.stackHeight) : null;
      return { ...row, blocks, count: blocks ? blocks.length : null };
    });
    return { ...o.table, rows, unreachable: box ? rows.filter((r) => r.blocks === null).length : 0 };
  });
  /**
   * The compound answer with its blocks (with the team's box, from it: both stacks at once, each
   * block under one of them), or null; `boxWarnings` says what the team's box cannot give.
   */
  protected readonly compound = computed(() => {
    const o = this.calc.value();
    if (o?.mode !== 'compound') return null;
    if (!this.ownBox()) return { ...o, boxWarnings: [] as string[] };
    const box = this.chosenBox();
    if (!box) return { ...o, blocksA: null, blocksB: null, boxWarnings: [] as string[] };
    const c = o.compound;
    const picked = compoundStackBlocks(teamGaugeBox(box), c.axisA.stackHeight, c.axisB.stackHeight, c.unit);
    return { ...o, blocksA: picked.blocksA, blocksB: picked.blocksB, boxWarnings: picked.warnings };
  });
  /** What the team's box cannot make in the table or the compound plate (the box once loaded). */
  protected readonly boxWarnings = computed(() => {
    if (!this.ownBox() || !this.chosenBox()) return [];
    const t = this.table();
    if (t?.unreachable) return [unmakeableRows(t.unreachable)];
    return this.compound()?.boxWarnings ?? [];
  });
  /** Whether the rows' blocks can be said (a standard set, or the team's box once loaded). */
  protected readonly blocksKnown = computed(() => this.hasStandardSet() || this.chosenBox() !== null);
  /** The table row drawn, kept within the rows there are. */
  protected readonly shownRow = computed(() => Math.min(this.selectedRow(), Math.max(0, (this.table()?.rows.length ?? 1) - 1)));
  /** Whether a set of blocks is chosen. */
  protected readonly hasSet = computed(() => this.setValue() !== '');
  /** Whether a standard set is chosen (the missing list belongs to it; the team's box keeps its own). */
  protected readonly hasStandardSet = computed(() => this.hasSet() && boxIdOf(this.setValue()) === null);
  /** The picker: the team's own sets in the unit first, then the standard sets. */
  protected readonly sets = computed(() => [
    ...this.boxes().filter((b) => b.unit === this.unit()).map((b) => ({ id: b.value, name: b.label })),
    ...setsInUnit(this.unit()),
  ]);
  /** One-tap bar lengths for the unit. */
  protected readonly barLengths = computed(() => BAR_LENGTHS[this.unit()]);
  /** The result list. */
  protected readonly items = computed(() => {
    const o = this.calc.value();
    const single = this.single();
    if (o && (o.mode === 'angle' || o.mode === 'stack') && single) {
      const items = outcomeItems({ ...o, single });
      // The box's blocks are on their way or cannot be had: say so where the blocks go.
      if (this.ownBox() && !single.blocks) {
        const at = items.findIndex((i) => i.label === 'Sensitivity');
        items.splice(at < 0 ? items.length : at, 0, { label: 'Blocks', value: this.boxNotes()?.asking ? '…' : 'none from the box', unit: '', note: 'From the team\'s box' });
      }
      return items;
    }
    const c = this.compound();
    const t = this.table();
    return c ? outcomeItems(c) : o?.mode === 'table' && t ? outcomeItems({ ...o, table: t }) : o ? outcomeItems(o) : [];
  });
  /** The drawing's model: the setting, or the table row shown. */
  protected readonly scene = computed(() => {
    const r = this.single();
    if (r) return sineBarSceneInput(r);
    const t = this.table();
    const row = t?.rows[this.shownRow()];
    return t && row ? tableRowScene(t, row) : null;
  });
  /** The compound plate's two views (lower plate about axis A, upper about axis B). */
  protected readonly compoundScenes = computed(() => {
    const o = this.compound();
    return o ? { a: compoundAxisScene(o.compound, 'A', o.blocksA), b: compoundAxisScene(o.compound, 'B', o.blocksB) } : null;
  });
  /**
   * For a steep angle: the same bar set at the complement, as advised, with its blocks (from the
   * team's box once it is read) and the sentence that gives its stack.
   */
  protected readonly complement = computed(() => {
    const r = this.single();
    const v = this.calc.values();
    if (!r || sineBarMode(v.mode) !== 'angle' || Number(r.angleDeg) <= 45) return null;
    const other = calculateSineBar({ ...toSineBarRequest(boxIdOf(v.set) === null ? v : { ...v, set: '', missing: '' }), angle: r.complementDeg });
    if (!other.ok) return null;
    const c = other.value;
    if (!this.ownBox()) return { result: c, text: complementStackText(c, v.set ? c.blocks : undefined) };
    const box = this.chosenBox();
    const blocks = box ? boxStackBlocks(box, c.stackHeight) : undefined;
    return { result: { ...c, blocks: blocks ?? null, blockCount: blocks ? blocks.length : null }, text: complementStackText(c, blocks) };
  });
  /** The complement drawing's model. */
  protected readonly complementScene = computed(() => {
    const c = this.complement();
    return c ? sineBarSceneInput(c.result) : null;
  });
  /** A name to start the save dialog with. */
  protected readonly suggestedName = computed(() => {
    const v = this.calc.values();
    switch (sineBarMode(v.mode)) {
      case 'stack':
        return `Sine bar ${v.barLength} ${v.unit}, stack ${v.stackHeight}`;
      case 'table':
        return `Sine table ${v.barLength} ${v.unit}, ${v.tableFrom} to ${v.tableTo} by ${v.tableStep}`;
      case 'compound':
        return `Compound plate ${v.barLength} ${v.unit}, ${v.compoundBy === 'stacks' ? `stacks ${v.stackHeight} and ${v.stackB}` : `${v.angle} and ${v.angleB}`}`;
      default:
        return `Sine bar ${v.barLength} ${v.unit} at ${v.angle}`;
    }
  });

  /** Converts the lengths, switches the unit and picks a set in the new unit. */
  protected changeUnit(to: LengthUnit): void {
    convertLengthControls(this.form.controls, SINE_BAR_LENGTH_FIELDS, this.unit(), to);
    const own = this.boxes().find((b) => b.unit === to);
    this.form.patchValue({ unit: to, set: this.hasSet() ? (own?.value ?? defaultSet(to)) : '', missing: '' });
  }

  /** A new set: the missing list belonged to the old one. */
  protected setChosen(): void {
    this.form.controls.missing.setValue('');
  }

  /** Sets the bar length to a standard one. */
  protected chooseBarLength(length: string): void {
    this.form.controls.barLength.setValue(length);
  }

  /** Draws one row of the table. */
  protected showRow(index: number): void {
    this.selectedRow.set(index);
  }

  /** Opens the print dialog. */
  protected printSheet(): void {
    window.print();
  }
}

