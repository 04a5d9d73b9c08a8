import type { FormControl } from '@angular/forms';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import type { Subscription } from 'rxjs';

/**
 * Puts a value no choice of the page offers (a mistyped address, an old bookmark: ?kind=foo) back
 * to the default, now and whenever it is set again; the address follows the form. Call in an
 * injection context, before the page's first calculation.
 */
export function keepKnownChoice<T>(control: FormControl<T>, isKnown: (value: unknown) => boolean, fallback: T): Subscription {
  const fix = (value: unknown) => {
    if (!isKnown(value)) control.setValue(fallback);
  };
  fix(control.value);
  return control.valueChanges.pipe(takeUntilDestroyed()).subscribe(fix);
}
