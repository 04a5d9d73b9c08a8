/** Shown in place of a drawing while the inputs give no answer. */
export const NO_ANSWER_TEXT = 'The drawing appears when the inputs give an answer.';

/** Shown in place of a drawing whose sizes are too far apart to draw to scale (the numbers still hold). */
export const UNDRAWABLE_TEXT = 'These sizes are too far apart to draw to scale; the numbers still hold.';

/**
 * Lays out a drawing, or gives null when the layout refuses its sizes (a dimension shrunk to
 * nothing beside a part thousands of times larger): the page then says so in words instead of
 * showing a broken drawing or logging an error.
 */
export function layoutOrNull<T>(layout: () => T): T | null {
  try {
    return layout();
  } catch {
    return null;
  }
}
