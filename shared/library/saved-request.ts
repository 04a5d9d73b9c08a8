import { type CalcResult, fail, succeed } from '../calc/step';
import { type AngleBlocksForm, toAngleBlocksRequest } from '../forms/angle-blocks-form';
import { type GaugeBlocksFormValues, boxIdOf, toGaugeStackRequest } from '../forms/gauge-blocks-form';
import { type LatheTapersForm, latheRequest } from '../forms/lathe-taper-form';
import { overPinsRequestFromInputs } from '../forms/pins-rolls-form';
import { type SineBarFormValues, toSineBarRequest } from '../forms/sine-bar-form';
import { type TaperFormValues, toTaperRequest } from '../forms/taper-form';

/**
 * A saved form read field by field: each field's text, or '' where the saved inputs have none
 * (a set-up saved before a field was added, or imported with fewer fields).
 */
function asForm<T>(inputs: Record<string, unknown>): T {
  return new Proxy({}, { get: (_target, key) => (typeof key === 'string' && typeof inputs[key] === 'string' ? inputs[key] : '') }) as T;
}

/** A set-up its calculator page answers but the set-up's own results cannot, with why. */
function openOnPage(what: string): CalcResult<never> {
  return fail('impossible', what, { body: 'open the set-up in its calculator to see the answer.' });
}

/**
 * The engine request of a saved set-up. A set-up saved from a calculator page keeps the page's
 * whole form (every field, the chosen mode, what is given); the page sends the engine only what
 * that choice uses, and so does this, through the same functions (shared/forms). Inputs already in
 * the engine's shape (saved or imported through the API) are used as they are.
 */
export function savedRequest(kind: string, inputs: Record<string, unknown>): CalcResult<Record<string, unknown>> {
  const has = (key: string) => typeof inputs[key] === 'string';
  switch (kind) {
    case 'taper':
      return has('given') ? succeed({ ...toTaperRequest(asForm<TaperFormValues>(inputs)) }) : succeed(inputs);
    case 'sine-bar': {
      if (!has('mode')) return succeed(inputs);
      const form = asForm<SineBarFormValues>(inputs);
      if (form.mode === 'table') return openOnPage('A table of sine-bar stacks');
      if (form.mode === 'compound') return openOnPage('A compound sine plate');
      // With one of the team's own boxes, the page works out the stack without a set and asks the
      // inventory for the blocks; the set-up's results give the stack.
      const request = toSineBarRequest(form);
      return succeed(boxIdOf(form.set) === null ? { ...request } : { ...request, set: undefined, missing: undefined });
    }
    case 'gauge-blocks': {
      if (!has('wearBlocks') && !has('missing')) return succeed(inputs);
      const form = asForm<GaugeBlocksFormValues>(inputs);
      if (boxIdOf(form.set) !== null) return openOnPage('A stack from one of the team\'s own gauge-block boxes');
      return succeed({ ...toGaugeStackRequest(form) });
    }
    case 'lathe-taper':
      return has('define') ? succeed({ ...latheRequest(asForm<LatheTapersForm>(inputs)) }) : succeed(inputs);
    case 'angle-blocks':
      return has('mode') ? toAngleBlocksRequest(asForm<AngleBlocksForm>(inputs)) : succeed(inputs);
    case 'pins-rolls':
      return succeed(overPinsRequestFromInputs(inputs));
    default:
      return succeed(inputs);
  }
}
