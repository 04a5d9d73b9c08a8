import { ComponentFixture, TestBed } from '@angular/core/testing';

import { LessonDrawing } from './lesson-drawing';
import { LESSONS } from './lessons';

describe('LessonDrawing', () => {
  let fixture: ComponentFixture<LessonDrawing>;

  async function show(kind: string): Promise<HTMLElement> {
    fixture = TestBed.createComponent(LessonDrawing);
    fixture.componentRef.setInput('kind', kind);
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  it.each(LESSONS.map((l) => [l.drawing]))('should draw %s as a labelled SVG with engine readouts', async (kind) => {
    const el = await show(kind);
    const svg = el.querySelector('svg')!;
    expect(svg.getAttribute('role')).toBe('img');
    expect(svg.getAttribute('aria-label')).toBeTruthy();
    expect(svg.querySelectorAll('polygon, rect, circle').length).toBeGreaterThan(0);
    expect(el.querySelectorAll('.readouts dd').length).toBeGreaterThan(0);
    expect(el.textContent).not.toMatch(/NaN|Infinity/);
  });

  it('should give the 14°30\' sine-bar stack of the demo sine plate from the engine: 1.2519 in on a 5 in bar', async () => {
    // H = 5 · sin 14.5° = 1.25186… (Army OD1642 formula; derived).
    const el = await show('sine-bar');
    expect(el.textContent).toContain('1.2519 in');
  });

  it('should read 3.3660 in over 0.500 in pins on a 2.000 in, 60° dovetail', async () => {
    // Machinery's Handbook "Measuring dovetail slides", REFERENCE.md §5.1 check value (derived).
    const el = await show('over-pins');
    expect(el.textContent).toContain('3.3660 in');
  });

  it('should show the fewest-blocks stack beside the last-digit stack', async () => {
    const el = await show('gauge-stack');
    // 2.826 in from the 81 set: 3 blocks (.126 + .700 + 2.000), REFERENCE.md §3.5 G7 (derived).
    expect(el.querySelector('.readouts')!.textContent).toContain('3: ');
    expect(el.querySelectorAll('rect.stack:not(.alt)')).toHaveLength(3);
  });
});
