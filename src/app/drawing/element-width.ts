import { DestroyRef, ElementRef, type Signal, afterNextRender, inject, signal } from '@angular/core';

/** Narrowest and widest view-box widths a drawing uses, in CSS pixels. */
export const DRAWING_WIDTH_RANGE = { min: 300, max: 960 } as const;

/** Clamps a measured width into {@link DRAWING_WIDTH_RANGE}, rounded to a whole pixel. */
export function clampDrawingWidth(width: number): number {
  if (!Number.isFinite(width) || width <= 0) return DRAWING_WIDTH_RANGE.max;
  return Math.round(Math.min(DRAWING_WIDTH_RANGE.max, Math.max(DRAWING_WIDTH_RANGE.min, width)));
}

/**
 * The host element's width as a signal, so a drawing can make its view box as wide as the
 * screen space it has and keep its text at a readable size. Starts at `initial` and follows
 * the element with a ResizeObserver after the first render (no observer: stays at `initial`).
 * Call in an injection context.
 */
export function hostWidth(initial = 640): Signal<number> {
  const host = inject<ElementRef<HTMLElement>>(ElementRef);
  const destroyRef = inject(DestroyRef);
  const width = signal(clampDrawingWidth(initial));
  afterNextRender(() => {
    if (typeof ResizeObserver === 'undefined') return;
    const observer = new ResizeObserver((entries) => {
      const measured = entries[0]?.contentRect.width ?? 0;
      // Hidden elements measure 0: keep the last width rather than collapsing the drawing.
      if (measured > 0) width.set(clampDrawingWidth(measured));
    });
    observer.observe(host.nativeElement);
    destroyRef.onDestroy(() => observer.disconnect());
  });
  return width.asReadonly();
}
