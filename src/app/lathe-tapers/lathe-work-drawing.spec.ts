import { TestBed } from '@angular/core/testing';

import { type Box, overlapArea, textBox } from '../drawing/label-placement';
import { LatheWorkDrawing } from './lathe-work-drawing';

/** A ResizeObserver that reports the host `width` px wide, as a phone's layout would. */
function observeWidth(width: number): void {
  (globalThis as unknown as { ResizeObserver: unknown }).ResizeObserver = class {
    constructor(private readonly report: (entries: unknown[]) => void) {}
    observe(): void {
      this.report([{ contentRect: { width } }]);
    }
    disconnect(): void {}
  };
}

/** The page's default: the Morse No. 3 arbor (REFERENCE.md §4.2) on an 8 in bar, turned with the compound. */
async function drawMorse3(width: number): Promise<SVGElement> {
  observeWidth(width);
  const fixture = TestBed.createComponent(LatheWorkDrawing);
  fixture.componentRef.setInput('work', { largeDiameter: 0.938, smallDiameter: 0.778, taperLength: 3.1875, workLength: 8, method: 'compound' });
  fixture.componentRef.setInput('texts', { large: 'Ø 0.9380 in', small: 'Ø 0.7780 in', taper: '3.1875 in', work: 'L 8 in' });
  fixture.componentRef.setInput('angleText', `α/2 = 1°26'16"`);
  fixture.detectChanges();
  await fixture.whenStable();
  fixture.detectChanges();
  return (fixture.nativeElement as HTMLElement).querySelector('svg')!;
}

/** The segments of an SVG path of M…L… pairs. */
function segments(d: string | null): [number, number, number, number][] {
  return Array.from((d ?? '').matchAll(/M([\d.-]+),([\d.-]+)L([\d.-]+),([\d.-]+)/g), (m) => [Number(m[1]), Number(m[2]), Number(m[3]), Number(m[4])]);
}

/** Whether a segment runs through a box (sampled, ends left out). */
function crosses([x1, y1, x2, y2]: [number, number, number, number], box: Box): boolean {
  for (let i = 1; i < 40; i++) {
    const x = x1 + ((x2 - x1) * i) / 40;
    const y = y1 + ((y2 - y1) * i) / 40;
    if (x > box.x && x < box.x + box.width && y > box.y && y < box.y + box.height) return true;
  }
  return false;
}

/** The estimated boxes of the diameters' texts (y is their baseline; the box is placed by its middle). */
function diameterBoxes(svg: SVGElement): Box[] {
  return Array.from(svg.querySelectorAll('text.dia-text'), (t) =>
    textBox({ x: Number(t.getAttribute('x')), y: Number(t.getAttribute('y')) - 5, anchor: t.getAttribute('text-anchor') as 'start' | 'middle' | 'end' }, t.textContent ?? ''),
  );
}

/** The 12-unit squares at both ends of each dimension's arrow path (both arrow heads). */
function arrowEnds(svg: SVGElement): Box[] {
  return Array.from(svg.querySelectorAll('text.dim-text'), (t) => t.parentElement!.querySelector('path.arrow')!).flatMap((arrow) => {
    const points = Array.from((arrow.getAttribute('d') ?? '').matchAll(/([\d.-]+),([\d.-]+)/g), (m) => ({ x: Number(m[1]), y: Number(m[2]) }));
    const xs = points.map((p) => p.x);
    const ys = points.map((p) => p.y);
    const [left, top, right, bottom] = [Math.min(...xs), Math.min(...ys), Math.max(...xs), Math.max(...ys)];
    return [{ x: left, y: top, width: 12, height: 12 }, { x: right - 12, y: bottom - 12, width: 12, height: 12 }];
  });
}

describe('LatheWorkDrawing labels', () => {
  // A 400 px phone: the page keeps 16 px each side, so the drawing is 368 px wide (358 on a 390 px one).
  it.each([358, 368])('should keep the angle\'s text off the dimensions\' arrows and clear of the diameters at %s px', async (width) => {
    const svg = await drawMorse3(width);
    const angle = svg.querySelector('text.angle-text')!;
    const angleBox = textBox({ x: Number(angle.getAttribute('x')), y: Number(angle.getAttribute('y')), anchor: angle.getAttribute('text-anchor') as 'start' | 'end' }, angle.textContent ?? '');
    for (const end of arrowEnds(svg)) expect(overlapArea(angleBox, end)).toBe(0);
    const [large, small] = diameterBoxes(svg);
    expect(overlapArea(angleBox, small) + overlapArea(angleBox, large)).toBe(0);
  });

  it('should keep the small diameter clear of the taper length\'s extension lines, and the angle\'s leader clear of both diameters, on a 400 px screen', async () => {
    const svg = await drawMorse3(368);
    const taper = Array.from(svg.querySelectorAll('text.dim-text')).find((t) => t.textContent?.trim() === '3.1875 in')!.parentElement!;
    const extensionLines = segments(taper.querySelector('path.ext')!.getAttribute('d'));
    expect(extensionLines).toHaveLength(2);
    const [large, small] = diameterBoxes(svg);
    for (const line of extensionLines) {
      expect(crosses(line, small)).toBe(false);
      expect(crosses(line, large)).toBe(false);
    }
    // The small diameter's text moved off its line: a leader joins them.
    expect(segments(svg.querySelector('path.dia-leader:not([d=""])')?.getAttribute('d') ?? '')).toHaveLength(1);
    const angle = svg.querySelector('text.angle-text')!;
    const angleBox = textBox({ x: Number(angle.getAttribute('x')), y: Number(angle.getAttribute('y')), anchor: angle.getAttribute('text-anchor') as 'start' | 'end' }, angle.textContent ?? '');
    for (const leader of segments(svg.querySelector('path.leader')!.getAttribute('d'))) {
      expect(crosses(leader, small)).toBe(false);
      expect(crosses(leader, large)).toBe(false);
    }
    expect(overlapArea(angleBox, small) + overlapArea(angleBox, large)).toBe(0);
  });

  it('should keep the small diameter between the extension lines, with no leader, where it fits', async () => {
    const svg = await drawMorse3(640);
    const small = svg.querySelectorAll('text.dia-text')[1];
    expect(small.getAttribute('text-anchor')).toBe('end');
    expect(Array.from(svg.querySelectorAll('path.dia-leader')).map((p) => p.getAttribute('d') ?? '')).toEqual(['', '']);
  });
});
