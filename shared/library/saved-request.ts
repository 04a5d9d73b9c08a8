import { type CalcResult, fail, impossible, succeed } from '../calc/step';
import { withLeadingZero } from '../api/setup';
import { savedForm } from '../forms/form-text';
import { type AngleBlocksForm, boxBlockAngles, toAngleBlocksRequest } from '../forms/angle-blocks-form';
import { type GaugeBlocksFormValues, boxIdOf, toGaugeStackRequest } from '../forms/gauge-blocks-form';
import { type LatheTapersForm, latheRequest } from '../forms/lathe-taper-form';
import { overPinsRequestFromInputs } from '../forms/pins-rolls-form';
import { type SineBarFormValues, toCompoundSineRequest, toSineBarRequest } from '../forms/sine-bar-form';
import { type TaperFormValues, toTaperRequest } from '../forms/taper-form';
import { type TeamBox, boxStackRequest } from './team-boxes';

/** A gauge-block form saved from its page: every field of it, as text (the engine takes a list of missing blocks). */
function isGaugeForm(inputs: Record<string, unknown>): boolean {
  return ['unit', 'target', 'set', 'missing', 'wearBlocks', 'grade', 'temperature'].every((k) => typeof inputs[k] === 'string');
}

/** What a set-up answered only on its calculator page says (see `openOnPage`). */
export const OPEN_ON_PAGE = 'open the set-up in its calculator to see the answer.';

/** A set-up its calculator page answers but the set-up's own results cannot, with why. */
function openOnPage(what: string): CalcResult<never> {
  return fail('impossible', what, { body: OPEN_ON_PAGE });
}

/**
 * The engine request of a saved set-up. A set-up saved from a calculator page keeps the page's
 * whole form (every field, the chosen mode, what is given); the page sends the engine only what
 * that choice uses, and so does this, through the same functions (shared/forms). Inputs already in
 * the engine's shape (saved or imported through the API) are used as they are.
 */
export function savedRequest(kind: string, inputs: Record<string, unknown>, box: TeamBox | null = null): CalcResult<Record<string, unknown>> {
  const has = (key: string) => typeof inputs[key] === 'string';
  switch (kind) {
    case 'taper':
      return has('given') ? succeed({ ...toTaperRequest(savedForm<TaperFormValues>(inputs)) }) : succeed(inputs);
    case 'sine-bar': {
      if (!has('mode')) return succeed(inputs);
      const form = savedForm<SineBarFormValues>(inputs);
      if (form.mode === 'table') return openOnPage('A table of sine-bar stacks');
      // A compound plate: both stacks from the form (with a team box, rounded as the page rounds them).
      if (form.mode === 'compound') return succeed({ ...toCompoundSineRequest(form) });
      // With one of the team's own boxes, the page works out the stack without a set and asks the
      // inventory for the blocks; the set-up's results give the stack.
      const request = toSineBarRequest(form);
      return succeed(boxIdOf(form.set) === null ? { ...request } : { ...request, set: undefined, missing: undefined });
    }
    case 'gauge-blocks': {
      if (!isGaugeForm(inputs)) return succeed(inputs);
      const form = savedForm<GaugeBlocksFormValues>(inputs);
      if (boxIdOf(form.set) !== null) {
        // The team's box at hand: the stack from what is in it, as the inventory route picks it.
        if (!box) return openOnPage('A stack from one of the team\'s own gauge-block boxes');
        const request = boxStackRequest(box, { target: withLeadingZero(form.target.trim()), grade: form.grade || undefined, wear: form.wearBlocks !== '' });
        return request ? succeed({ ...request }) : impossible('Gauge stack', 'set', 'has every block marked missing or damaged in the team\'s inventory');
      }
      return succeed({ ...toGaugeStackRequest(form) });
    }
    case 'lathe-taper':
      return has('define') ? succeed({ ...latheRequest(savedForm<LatheTapersForm>(inputs)) }) : succeed(inputs);
    case 'angle-blocks':
      if (!has('mode')) return succeed(inputs);
      if (boxIdOf(savedForm<AngleBlocksForm>(inputs).set) !== null) {
        // The team's box at hand: its usable blocks, as the angle-block page solves with them.
        if (!box) return openOnPage('A combination from one of the team\'s own angle-block boxes');
        const form = savedForm<AngleBlocksForm>(inputs);
        const request = toAngleBlocksRequest({ mode: form.mode, set: '', angle: form.angle, combination: form.combination });
        if (!request.ok) return request;
        const blocks = boxBlockAngles(box.blocks);
        if (blocks.length === 0) return impossible('Angle blocks', 'set', 'has every block marked missing or damaged in the team\'s inventory');
        const { set: _set, ...rest } = request.value;
        return succeed({ ...rest, blocks });
      }
      return toAngleBlocksRequest(savedForm<AngleBlocksForm>(inputs));
    case 'pins-rolls':
      return succeed(overPinsRequestFromInputs(inputs));
    default:
      return succeed(inputs);
  }
}

/** Which two of angle, taper length, end and face length engine-shaped taper inputs give, as the page's `given`. */
function takenGiven(inputs: Record<string, unknown>): string | undefined {
  const present = (key: string) => inputs[key] !== undefined && inputs[key] !== null && inputs[key] !== '';
  const parts = [
    present('angle') ? 'angle' : null,
    present('taperLength') ? 'length' : null,
    present('endThickness') || present('removedAtEnd') ? 'end' : null,
    present('faceLength') ? 'face' : null,
  ].filter((p): p is string => p !== null);
  return parts.length === 2 ? parts.join('-') : undefined;
}

/** An engine combination of angle blocks as the angle-block page types it: `27° − 9° + 27'`. */
export function combinationText(blocks: ReadonlyArray<{ angle?: unknown; reversed?: unknown }>): string {
  return blocks.map((b, i) => `${b.reversed ? '− ' : i ? '+ ' : ''}${String(b.angle ?? '')}`).join(' ');
}

/** A list of sizes as the pages type them. */
function listText(value: unknown): unknown {
  return Array.isArray(value) ? value.join(', ') : value;
}

/**
 * Page fields of engine-shaped inputs: the figures the page's request reads start empty (so none
 * of the page's own example values joins the request), then the saved ones go in.
 */
function filled(blank: readonly string[], fields: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = Object.fromEntries(blank.map((k) => [k, '']));
  for (const [k, v] of Object.entries(fields)) if (v !== undefined && v !== null) out[k] = v;
  return out;
}

/**
 * The form fields of a calculator page for a saved set-up ("Open in …"): a form saved from the page
 * as it is; inputs in the engine's shape (saved or imported through the API) with the page's mode
 * and choices set to match them and each figure in the field the page reads it from, so the page
 * makes the same request the set-up's results do.
 */
export function savedFormFields(kind: string, inputs: Record<string, unknown>): Record<string, unknown> {
  const has = (key: string) => inputs[key] !== undefined && inputs[key] !== null && inputs[key] !== '';
  switch (kind) {
    case 'taper': {
      if (typeof inputs['given'] === 'string') return inputs;
      const chamfer = inputs['shape'] === 'chamfer' || (!has('endThickness') && has('removedAtEnd'));
      const given = takenGiven(inputs);
      // The part length is the page's own (for its drawing): unknown for engine-shaped inputs, so empty.
      return filled(['angle', 'taperLength', 'endThickness', 'faceLength', 'depthPerPass', 'fluteLength', 'cutterDiameter', 'partLength'], {
        ...inputs, shape: chamfer ? 'chamfer' : 'taper', endThickness: inputs['endThickness'] ?? inputs['removedAtEnd'], given,
      });
    }
    case 'sine-bar':
      if (typeof inputs['mode'] === 'string') return inputs;
      return filled(['angle', 'stackHeight', 'set', 'missing'], { ...inputs, missing: listText(inputs['missing']), mode: has('stackHeight') && !has('angle') ? 'stack' : 'angle' });
    case 'gauge-blocks':
      if (isGaugeForm(inputs)) return inputs;
      return filled(['missing', 'wearBlocks', 'grade', 'temperature'], { ...inputs, missing: listText(inputs['missing']) });
    case 'lathe-taper': {
      if (typeof inputs['define'] === 'string') return inputs;
      const define = has('standard') ? 'standard' : has('taperPerFoot') ? 'tpf' : has('includedAngle') ? 'angle' : 'diameters';
      return filled(['taperPerFoot', 'includedAngle', 'largeDiameter', 'smallDiameter', 'length', 'workLength', 'stations'], { ...inputs, define, stations: listText(inputs['stations']) });
    }
    case 'angle-blocks': {
      if (typeof inputs['mode'] === 'string') return inputs;
      const combination = inputs['combination'];
      if (!Array.isArray(combination)) return { ...inputs, mode: 'find' };
      return { set: inputs['set'], mode: 'total', combination: combinationText(combination) };
    }
    case 'pins-rolls':
      return pinsFormFields(inputs);
    default:
      return inputs;
  }
}

/** The pins-and-rolls form fields of engine-shaped inputs (see `savedFormFields`). */
function pinsFormFields(inputs: Record<string, unknown>): Record<string, unknown> {
  if (typeof inputs['mode'] === 'string') return inputs;
  const has = (key: string) => inputs[key] !== undefined && inputs[key] !== null && inputs[key] !== '';
  const { measurement, measurement1, measurement2, taperPerFoot, includedAngle, ...rest } = inputs;
  switch (inputs['kind']) {
    case 'dovetail':
      return filled(['depth'], has('measurement') && !has('width') ? { ...rest, mode: 'check', reading: measurement, width: '' } : { ...rest, mode: 'cut' });
    case 'v-groove':
      return has('measurement') && !has('grooveWidth') ? { ...rest, includedAngle, mode: 'check', pinHeight: measurement, grooveWidth: '' } : { ...rest, includedAngle, mode: 'cut' };
    case 'dovetail-angle':
      return { ...inputs, mode: 'cut' };
    case 'taper-two-heights':
      return { ...rest, mode: 'cut', lowerReading: measurement1, upperReading: measurement2 };
    case 'taper-discs': {
      const discGiven = has('taperPerFoot') ? 'taperPerFoot' : has('includedAngle') ? 'includedAngle' : 'centreDistance';
      return { ...rest, mode: 'cut', discGiven, discTaperPerFoot: taperPerFoot, discAngle: includedAngle };
    }
    default:
      return { ...inputs, mode: 'cut' };
  }
}
