import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, ElementRef, computed, input, linkedSignal, signal, viewChild } from '@angular/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSliderModule } from '@angular/material/slider';

import { Dec, cosDeg, sinDeg, tanDeg } from '../../../shared/calc/decimal-math';
import { calculateGaugeStack } from '../../../shared/calc/gauge-stack';
import { calculateLatheTaper } from '../../../shared/calc/lathe-taper';
import { calculateOverPins } from '../../../shared/calc/over-pins';
import { calculateSineBar } from '../../../shared/calc/sine-bar';
import { calculateTaper } from '../../../shared/calc/taper';
import {
  type AngleGrip,
  LESSON_VIEW,
  angleFromPointer,
  dovetailScene,
  latheTaperScene,
  pointsAttr,
  sineBarScene,
  snapAngle,
  stackBlocks,
  taperTriangle,
  toViewPoint,
} from '../../../shared/training/lesson-geometry';
import type { LessonDrawingKind } from './lessons';

/**
 * Slider range, step, start value and label of each drawing; `page` is the Page Up / Page Down
 * move where ten steps would still be too small to cross the range.
 */
const SLIDERS: Readonly<Record<LessonDrawingKind, { min: number; max: number; step: number; start: number; label: string; unit: string; page?: number }>> = {
  'taper-triangle': { min: 1, max: 30, step: 0.5, start: 7.5, label: 'Angle α', unit: '°' },
  'sine-bar': { min: 0, max: 60, step: 0.5, start: 14.5, label: 'Angle θ', unit: '°' },
  // A thousandth per arrow press, a tenth per page; a length to the ten-thousandth is typed in the box.
  'gauge-stack': { min: 0.3, max: 6, step: 0.001, start: 2.826, label: 'Stack length', unit: 'in', page: 0.1 },
  'lathe-taper': { min: 0.0625, max: 3, step: 0.0625, start: 0.625, label: 'Taper per foot', unit: 'in/ft' },
  'over-pins': { min: 40, max: 70, step: 1, start: 60, label: 'Dovetail angle α', unit: '°' },
};

/** One readout under a drawing: a name and the engine's value. */
interface Readout {
  label: string;
  value: string;
}

const f4 = (d: Dec) => d.toFixed(4);

/** Name of the drag handle of each angle drawing (kept apart from the slider's own name). */
const GRIP_NAMES: Partial<Record<LessonDrawingKind, string>> = {
  'taper-triangle': 'Drag on the drawing to set α',
  'sine-bar': 'Drag on the drawing to set θ',
  'over-pins': 'Drag on the drawing to set the dovetail α',
};

/** Keys that move an ARIA slider, as a number of steps (±Infinity for the ends). */
const KEY_STEPS: Readonly<Record<string, number>> = {
  ArrowUp: 1,
  ArrowRight: 1,
  ArrowDown: -1,
  ArrowLeft: -1,
  PageUp: 10,
  PageDown: -10,
  Home: -Infinity,
  End: Infinity,
};

/**
 * The interactive drawing of a lesson: an SVG of the set-up driven by a slider. Where the slider is
 * an angle, a round handle on the moving arm drags the same value (mouse, pen or touch) and works
 * as a slider from the keyboard too. The geometry comes from pure functions
 * (shared/training/lesson-geometry); every number printed comes from the engine.
 */
@Component({
  selector: 'sw-lesson-drawing',
  imports: [MatSliderModule, MatFormFieldModule, MatInputModule, DecimalPipe],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <figure class="lesson-drawing">
      <svg #drawing [attr.viewBox]="viewBox" role="group" aria-label="Lesson drawing" preserveAspectRatio="xMidYMid meet">
        <g role="img" [attr.aria-label]="ariaLabel()">
        @switch (kind()) {
          @case ('taper-triangle') {
            @let t = taper();
            <line x1="10" [attr.y1]="t.cutY" x2="470" [attr.y2]="t.cutY" class="cut-line" />
            <polygon [attr.points]="points(t.block)" class="block" />
            <polygon [attr.points]="points(t.part)" class="part" />
            <polygon [attr.points]="points(t.removed)" class="removed" />
            <path [attr.d]="t.arc" class="arc" />
            <text [attr.x]="t.corner.angle.x + 46" [attr.y]="t.corner.angle.y - 6" class="tag">α</text>
            <text [attr.x]="(t.corner.angle.x + t.corner.right.x) / 2 - 8" [attr.y]="(t.corner.angle.y + t.corner.right.y) / 2 - 10" class="tag">L</text>
            <text [attr.x]="t.corner.right.x + 8" [attr.y]="(t.corner.right.y + t.corner.far.y) / 2 + 4" class="tag">d</text>
            <text x="14" [attr.y]="t.cutY - 6" class="note">level cut</text>
          }
          @case ('sine-bar') {
            @let s = sine();
            <line x1="20" y1="270" x2="460" y2="270" class="plate" />
            <polygon [attr.points]="points(s.stack)" class="stack" />
            <polygon [attr.points]="points(s.triangle)" class="removed" />
            <polygon [attr.points]="points(s.bar)" class="part" />
            <circle [attr.cx]="s.rolls[0].x" [attr.cy]="s.rolls[0].y" [attr.r]="s.rollRadius" class="roll" />
            <circle [attr.cx]="s.rolls[1].x" [attr.cy]="s.rolls[1].y" [attr.r]="s.rollRadius" class="roll" />
            <path [attr.d]="s.arc" class="arc" />
            <text [attr.x]="s.rolls[0].x + 56" [attr.y]="s.rolls[0].y - 4" class="tag">θ</text>
            <text [attr.x]="s.rolls[1].x + 30" [attr.y]="270 - s.stackHeight / 2" class="tag">H</text>
          }
          @case ('gauge-stack') {
            <line x1="20" y1="280" x2="460" y2="280" class="plate" />
            @for (b of fewestBlocks(); track $index) {
              <rect [attr.x]="b.x" [attr.y]="b.y" [attr.width]="b.width" [attr.height]="b.height" class="stack" />
              <text [attr.x]="b.x + b.width / 2" [attr.y]="b.y + b.height / 2 + 5" class="block-label">{{ b.label }}</text>
            }
            @for (b of lastDigitBlocks(); track $index) {
              <rect [attr.x]="b.x" [attr.y]="b.y" [attr.width]="b.width" [attr.height]="b.height" class="stack alt" />
              <text [attr.x]="b.x + b.width / 2" [attr.y]="b.y + b.height / 2 + 5" class="block-label">{{ b.label }}</text>
            }
            <text x="130" y="294" class="note" text-anchor="middle">fewest</text>
            <text x="350" y="294" class="note" text-anchor="middle">last digit first</text>
          }
          @case ('lathe-taper') {
            @let l = lathe();
            <line [attr.x1]="l.axis[0].x" [attr.y1]="l.axis[0].y" [attr.x2]="l.axis[1].x" [attr.y2]="l.axis[1].y" class="axis" />
            <polygon [attr.points]="points(l.outline)" class="part" />
            <line [attr.x1]="l.outline[0].x" [attr.y1]="l.outline[0].y" [attr.x2]="l.outline[1].x" [attr.y2]="l.outline[0].y" class="cut-line" />
            <path [attr.d]="l.arc" class="arc" />
            <text [attr.x]="l.label.x" [attr.y]="l.label.y" class="tag">α/2</text>
            <text x="240" y="290" class="note" text-anchor="middle">{{ l.exaggeration === 1 ? 'angle drawn to scale' : 'angle drawn ' + l.exaggeration + '× steeper' }}</text>
          }
          @case ('over-pins') {
            @let p = pins();
            <line x1="10" y1="230" x2="470" y2="230" class="plate" />
            <polygon [attr.points]="points(p.outline)" class="part" />
            <circle [attr.cx]="p.pins[0].x" [attr.cy]="p.pins[0].y" [attr.r]="p.pinRadius" class="roll" />
            <circle [attr.cx]="p.pins[1].x" [attr.cy]="p.pins[1].y" [attr.r]="p.pinRadius" class="roll" />
            <line [attr.x1]="p.measure[0].x" [attr.y1]="p.measure[0].y" [attr.x2]="p.measure[1].x" [attr.y2]="p.measure[1].y" class="dim" />
            <line [attr.x1]="p.width[0].x" [attr.y1]="p.width[0].y" [attr.x2]="p.width[1].x" [attr.y2]="p.width[1].y" class="dim alt" />
            <path [attr.d]="p.arc" class="arc" />
            <text x="240" [attr.y]="p.measure[0].y + 18" class="tag" text-anchor="middle">x over the pins</text>
            <text x="240" [attr.y]="p.width[0].y + 16" class="note" text-anchor="middle">a</text>
          }
        }
        </g>
        @if (grip(); as g) {
          <g
            class="grip"
            [class.dragging]="dragging()"
            [attr.transform]="'translate(' + g.handle.x + ' ' + g.handle.y + ')'"
            role="slider"
            tabindex="0"
            [attr.aria-label]="gripName()"
            [attr.aria-valuemin]="slider().min"
            [attr.aria-valuemax]="slider().max"
            [attr.aria-valuenow]="value()"
            [attr.aria-valuetext]="value() + '°'"
            (pointerdown)="startDrag($event)"
            (pointermove)="dragTo($event)"
            (pointerup)="endDrag($event)"
            (pointercancel)="endDrag($event)"
            (lostpointercapture)="dragging.set(false)"
            (keydown)="stepWithKey($event)"
          >
            <circle r="18" class="grip-hit" />
            <circle r="14" class="grip-ring" />
            <circle r="9" class="grip-knob" />
          </g>
        }
      </svg>
      <figcaption>
        <label class="slider-row">
          <span>{{ slider().label }}: <strong>{{ value() | number: valueFormat() }}{{ slider().unit === '°' ? '°' : ' ' + slider().unit }}</strong></span>
          <mat-slider [min]="slider().min" [max]="slider().max" [step]="slider().step" discrete>
            <input matSliderThumb [value]="value()" (valueChange)="value.set($event)" [attr.aria-label]="slider().label" (keydown)="pageWithKey($event)">
          </mat-slider>
        </label>
        @if (kind() === 'gauge-stack') {
          <mat-form-field appearance="outline" subscriptSizing="dynamic" class="length-box">
            <mat-label>Type a stack length</mat-label>
            <input matInput inputmode="decimal" autocomplete="off" [value]="value().toFixed(4)" (change)="typeLength($any($event.target).value)">
            <span matTextSuffix>in</span>
            <mat-hint>{{ lengthHint }}</mat-hint>
          </mat-form-field>
          @if (lengthError()) { <p class="length-error" role="alert">{{ lengthError() }}</p> }
        }
        <dl class="readouts">
          @for (r of readouts(); track r.label) {
            <div><dt>{{ r.label }}</dt><dd>{{ r.value }}</dd></div>
          }
        </dl>
      </figcaption>
    </figure>
  `,
  styles: `
    :host { display: block; }
    figure { margin: 0; display: grid; gap: 8px; container-type: inline-size; }
    svg { width: 100%; max-height: 340px; background: var(--mat-sys-surface-container-low); border-radius: 12px; }
    .part { fill: var(--mat-sys-secondary-container); stroke: var(--mat-sys-on-surface); stroke-width: 1.5; }
    .block, .stack { fill: var(--mat-sys-tertiary-container); stroke: var(--mat-sys-on-surface); stroke-width: 1; }
    .stack.alt { fill: var(--mat-sys-surface-container-highest); }
    .removed { fill: var(--mat-sys-error); fill-opacity: 0.25; stroke: var(--mat-sys-error); stroke-width: 1.5; }
    .roll { fill: var(--mat-sys-surface); stroke: var(--mat-sys-on-surface); stroke-width: 1.5; }
    .arc { fill: none; stroke: var(--mat-sys-primary); stroke-width: 2; }
    .cut-line, .axis { stroke: var(--mat-sys-primary); stroke-dasharray: 6 4; stroke-width: 1.2; }
    .plate { stroke: var(--mat-sys-on-surface); stroke-width: 2; }
    .dim { stroke: var(--mat-sys-primary); stroke-width: 2; }
    .dim.alt { stroke: var(--mat-sys-on-surface-variant); }
    .tag { font: 600 16px 'IBM Plex Sans', sans-serif; fill: var(--mat-sys-primary); }
    .note { font: 13px 'IBM Plex Sans', sans-serif; fill: var(--mat-sys-on-surface-variant); }
    .block-label { font: 12px 'IBM Plex Sans', sans-serif; text-anchor: middle; fill: var(--mat-sys-on-surface); }
    /*
     * Text sizes are in view units (480 across), so a narrow drawing shrinks them: on a phone the
     * text grows in view units to stay about 11 px or more on the screen.
     */
    @container (max-width: 420px) {
      .tag { font-size: 19px; }
      .note { font-size: 15px; }
      .block-label { font-size: 14px; }
    }
    @container (max-width: 360px) {
      .tag { font-size: 21px; }
      .note { font-size: 17px; }
      .block-label { font-size: 16px; }
    }
    .slider-row { display: grid; gap: 4px; }
    .length-box { width: min(260px, 100%); }
    .length-error { color: var(--mat-sys-error); margin: 0; }
    // The slider keeps 8px of margin each side for its thumb: its width leaves room for it, so it never runs past the panel.
    mat-slider { width: calc(100% - 16px); max-width: 520px; }
    .readouts { display: flex; flex-wrap: wrap; gap: 8px 24px; margin: 0; }
    .readouts div { display: grid; }
    dt { font: var(--mat-sys-label-medium); color: var(--mat-sys-on-surface-variant); }
    dd { margin: 0; font: var(--mat-sys-title-medium); font-variant-numeric: tabular-nums; }
    /* The drag handle: 36 view units across (never under 24 px at the narrowest drawing), no scrolling on touch. */
    .grip { cursor: grab; touch-action: none; outline: none; }
    .grip.dragging { cursor: grabbing; }
    .grip-hit { fill: var(--mat-sys-primary); fill-opacity: 0; pointer-events: all; }
    .grip:hover .grip-hit, .grip.dragging .grip-hit { fill-opacity: 0.16; }
    .grip-knob { fill: var(--mat-sys-primary); stroke: var(--mat-sys-surface); stroke-width: 2.5; }
    .grip-ring { fill: none; stroke: var(--mat-sys-on-surface); stroke-width: 3; opacity: 0; }
    .grip:focus-visible .grip-ring { opacity: 1; }
  `,
})
export class LessonDrawing {
  /** Which set-up to draw. */
  readonly kind = input.required<LessonDrawingKind>();

  private readonly drawing = viewChild.required<ElementRef<SVGSVGElement>>('drawing');

  protected readonly viewBox = `0 0 ${LESSON_VIEW.width} ${LESSON_VIEW.height}`;
  /** The slider's settings for this drawing. */
  protected readonly slider = computed(() => SLIDERS[this.kind()]);
  /** The slider's value; back to the drawing's start value when the kind changes. */
  protected readonly value = linkedSignal(() => SLIDERS[this.kind()].start);
  /** Number format of the slider value. */
  protected readonly valueFormat = computed(() => (this.kind() === 'gauge-stack' || this.kind() === 'lathe-taper' ? '1.4-4' : '1.0-1'));

  protected readonly taper = computed(() => taperTriangle(this.value()));
  protected readonly sine = computed(() => sineBarScene(this.value()));
  protected readonly lathe = computed(() => latheTaperScene(this.value()));
  protected readonly pins = computed(() => dovetailScene(this.value()));
  /** Where the angle can be dragged; null when the slider is not an angle. */
  protected readonly grip = computed<AngleGrip | null>(() => {
    switch (this.kind()) {
      case 'taper-triangle':
        return this.taper().grip;
      case 'sine-bar':
        return this.sine().grip;
      case 'over-pins':
        return this.pins().grip;
      default:
        return null;
    }
  });
  protected readonly gripName = computed(() => GRIP_NAMES[this.kind()] ?? '');
  /** Whether a pointer is dragging the handle. */
  protected readonly dragging = signal(false);
  private readonly stack = computed(() => {
    const r = calculateGaugeStack({ target: new Dec(this.value()).toFixed(4), unit: 'in', set: 'inch-81' });
    return r.ok ? r.value : null;
  });
  protected readonly fewestBlocks = computed(() => stackBlocks(this.stack()?.blocks ?? [], 40, 70, 120));
  protected readonly lastDigitBlocks = computed(() => stackBlocks(this.stack()?.lastDigit?.blocks ?? [], 40, 290, 120));

  /** What the drawing shows, for screen readers. */
  protected readonly ariaLabel = computed(() => `${this.slider().label} ${this.value()} ${this.slider().unit}: ${this.readouts().map((r) => `${r.label} ${r.value}`).join(', ')}`);

  /** The engine's numbers for the slider value. */
  protected readonly readouts = computed<Readout[]>(() => {
    const v = new Dec(this.value());
    switch (this.kind()) {
      case 'taper-triangle': {
        const r = calculateTaper({ unit: 'in', thickness: '1.000', taperLength: '1.500', angle: v.toString() });
        if (!r.ok) return [{ label: 'Note', value: r.error }];
        return [
          { label: 'sin α', value: f4(sinDeg(v)) },
          { label: 'cos α', value: f4(cosDeg(v)) },
          { label: 'tan α', value: f4(tanDeg(v)) },
          { label: 'For L = 1.500 in: d = L · tan α', value: `${r.value.removedAtEnd} in` },
          { label: 'Face length F = L / cos α', value: `${r.value.faceLength} in` },
          { label: 'Depth to stop h = L · sin α', value: `${r.value.depthToStop} in` },
        ];
      }
      case 'sine-bar': {
        if (v.isZero()) return [{ label: 'Stack H on a 5 in bar', value: '0.0000 in (bar flat on the plate)' }];
        const r = calculateSineBar({ unit: 'in', barLength: '5', angle: v.toString() });
        if (!r.ok) return [{ label: 'Note', value: r.error }];
        return [
          { label: 'sin θ', value: f4(sinDeg(v)) },
          { label: 'Stack H = 5 · sin θ', value: `${r.value.stackHeight} in` },
          { label: 'Angle error per 0.0001 in of stack', value: `${r.value.sensitivityArcSec}″` },
        ];
      }
      case 'gauge-stack': {
        const s = this.stack();
        if (!s) return [{ label: 'Note', value: 'That length cannot be built from the 81-piece set.' }];
        return [
          { label: 'Fewest blocks', value: `${s.count}: ${s.blocks.join(' + ')}` },
          { label: 'Last digit first', value: s.lastDigit ? `${s.lastDigit.count}: ${s.lastDigit.blocks.join(' + ')}` : 'gets stuck' },
        ];
      }
      case 'lathe-taper': {
        const r = calculateLatheTaper({ unit: 'in', taperPerFoot: v.toString() });
        if (!r.ok) return [{ label: 'Note', value: r.error }];
        return [
          { label: 'Half angle (compound)', value: `${r.value.halfAngleDeg}° (${r.value.halfAngleDms})` },
          { label: 'Included angle', value: `${r.value.includedAngleDeg}°` },
          { label: 'Ratio', value: r.value.ratio },
        ];
      }
      case 'over-pins': {
        const r = calculateOverPins({ kind: 'dovetail', side: 'male', unit: 'in', angle: v.toString(), rollDiameter: '0.500', width: '2.000' });
        if (!r.ok) return [{ label: 'Note', value: r.error }];
        return [
          { label: 'Roll constant 1 + cot(α/2)', value: r.value.steps[0]?.value ?? '' },
          { label: 'Over 0.500 in pins, a = 2.000 in', value: `${r.value.values['measurement']} in` },
        ];
      }
    }
  });

  /** Points as SVG text. */
  protected points = pointsAttr;

  /** Grabs the handle: later moves of this pointer come here even when it leaves the handle. */
  protected startDrag(event: PointerEvent): void {
    if (event.button !== 0) return;
    // No text selection or native drag while the handle is held.
    event.preventDefault();
    const handle = event.currentTarget as SVGGElement;
    handle.setPointerCapture?.(event.pointerId);
    handle.focus({ preventScroll: true });
    this.dragging.set(true);
  }

  /** Turns the arm to the pointer: its angle about the vertex, clamped and stepped like the slider. */
  protected dragTo(event: PointerEvent): void {
    const grip = this.grip();
    const ctm = this.drawing().nativeElement.getScreenCTM();
    if (!this.dragging() || !grip || !ctm) return;
    const pointer = toViewPoint(ctm.inverse(), event.clientX, event.clientY);
    this.value.set(angleFromPointer(pointer, grip, this.value(), this.slider()));
  }

  /** Lets go of the handle. */
  protected endDrag(event: PointerEvent): void {
    const handle = event.currentTarget as SVGGElement;
    if (handle.hasPointerCapture?.(event.pointerId)) handle.releasePointerCapture(event.pointerId);
    this.dragging.set(false);
  }

  protected readonly lengthHint = `From ${SLIDERS['gauge-stack'].min.toFixed(4)} to ${SLIDERS['gauge-stack'].max.toFixed(4)} in, to 0.0001 in; Enter to build it.`;
  /** Why the typed length was not taken, if so. */
  protected readonly lengthError = signal<string | null>(null);

  /** Takes a typed stack length (0.3000–6.0000 in, at most four decimals, a comma as the decimal mark). */
  protected typeLength(text: string): void {
    const { min, max } = this.slider();
    const cleaned = text.trim().replace(',', '.').replace(/\s*(in|")$/i, '');
    const length = Number(cleaned);
    if (!/^(\d+(\.\d{0,4})?|\.\d{1,4})$/.test(cleaned)) {
      this.lengthError.set('Type the length in inches as a number with at most four decimals, e.g. 2.8265.');
      return;
    }
    if (length < min || length > max) {
      this.lengthError.set(`Type a length from ${min.toFixed(4)} to ${max.toFixed(4)} in.`);
      return;
    }
    this.lengthError.set(null);
    this.value.set(length);
  }

  /** Page Up / Page Down on the slider move a bigger step where the drawing sets one (the stack length: 0.1 in). */
  protected pageWithKey(event: KeyboardEvent): void {
    const { min, max, page } = this.slider();
    if (page === undefined || (event.key !== 'PageUp' && event.key !== 'PageDown')) return;
    event.preventDefault();
    const next = this.value() + (event.key === 'PageUp' ? page : -page);
    // Whole thousandths, inside the range.
    this.value.set(Math.min(max, Math.max(min, Math.round(next * 1000) / 1000)));
  }

  /** Arrow keys move one step, Page Up/Down ten, Home/End go to the ends (as the slider does). */
  protected stepWithKey(event: KeyboardEvent): void {
    const steps = KEY_STEPS[event.key];
    if (steps === undefined) return;
    event.preventDefault();
    const { min, max, step } = this.slider();
    const next = steps === Infinity ? max : steps === -Infinity ? min : this.value() + steps * step;
    this.value.set(snapAngle(next, this.slider()));
  }
}
