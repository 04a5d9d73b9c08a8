/**
 * A thin adapter between the training generators and the calculation engine: it unwraps an
 * engine answer (a generator only asks for values in range, so a failure is a bug worth a loud
 * error) and cuts a derivation down to the step that gives the asked-for answer.
 */
import type { CalcResult, Step } from '../calc/step';

/** The engine's answer, or an Error naming the exercise and the engine's message. */
export function engineValue<T>(exercise: string, result: CalcResult<T>): T {
  if (!result.ok) throw new Error(`Training ${exercise}: the engine refused a generated problem (${result.error})`);
  return result.value;
}

/** The derivation up to and including the first step whose label starts with `label`. */
export function stepsUpTo(exercise: string, steps: readonly Step[], label: string): Step[] {
  const index = steps.findIndex((s) => s.label.startsWith(label));
  if (index < 0) throw new Error(`Training ${exercise}: the engine's derivation has no step "${label}"`);
  return steps.slice(0, index + 1);
}
