import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import type { AbstractControl } from '@angular/forms';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';

import { Dec } from '../../../shared/calc/decimal-math';
import { UNIT_DECIMALS, convertLength, type LengthUnit } from '../../../shared/units/length-unit';

const DECIMAL_TEXT = /^\s*[+-]?(\d+(\.\d*)?|\.\d+)\s*$/;

/**
 * Converts a length typed as text from one unit to the other, rounded to the target unit's
 * resolution (0.0001 in, 0.001 mm) with trailing zeros dropped. Text that is not a number
 * (empty, or a typo the user is still fixing) comes back unchanged.
 */
export function convertLengthText(text: string, from: LengthUnit, to: LengthUnit): string {
  if (from === to || !DECIMAL_TEXT.test(text)) return text;
  const converted = convertLength(new Dec(text.trim()), from, to).toDecimalPlaces(UNIT_DECIMALS[to], Dec.ROUND_HALF_UP);
  return converted.isZero() ? '0' : converted.toString();
}

/** Converts the length controls `names` of a form from one unit to the other, in one value change. */
export function convertLengthControls(
  controls: Readonly<Record<string, AbstractControl<string>>>,
  names: readonly string[],
  from: LengthUnit,
  to: LengthUnit,
): void {
  for (const name of names) {
    const control = controls[name];
    if (!control) throw new Error(`convertLengthControls: the form has no control "${name}"`);
    control.setValue(convertLengthText(control.value ?? '', from, to), { emitEvent: false });
  }
}

/** The in/mm switch of a page; the page converts its entered lengths when it changes. */
@Component({
  selector: 'sw-unit-toggle',
  imports: [MatButtonToggleGroup, MatButtonToggle],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-button-toggle-group class="unit-toggle" [value]="unit()" (change)="choose($event.value)"
                             hideSingleSelectionIndicator aria-label="Length unit">
      <mat-button-toggle value="in" aria-label="Inches">in</mat-button-toggle>
      <mat-button-toggle value="mm" aria-label="Millimetres">mm</mat-button-toggle>
    </mat-button-toggle-group>
  `,
  styles: `
    .unit-toggle { --mat-button-toggle-height: 48px; font-weight: 600; }
    .unit-toggle ::ng-deep .mat-button-toggle-label-content { min-width: 40px; }
  `,
})
export class UnitToggle {
  /** The unit in use. */
  readonly unit = input.required<LengthUnit>();
  /** Emits the newly chosen unit. */
  readonly unitChange = output<LengthUnit>();

  /** Passes a change of unit on to the page. */
  protected choose(value: unknown): void {
    if ((value === 'in' || value === 'mm') && value !== this.unit()) this.unitChange.emit(value);
  }
}
