/** Every kind of generated exercise, one or more per calculation area. */
export const EXERCISE_TYPES = [
  'taper-depth',
  'taper-end-thickness',
  'taper-angle',
  'sine-stack',
  'sine-angle',
  'gauge-fewest',
  'lathe-half-angle',
  'lathe-offset',
  'dovetail-pins',
] as const;

/** One kind of generated exercise. */
export type ExerciseType = (typeof EXERCISE_TYPES)[number];

/** How each exercise type is named on screen, and the calculation area it drills. */
export const EXERCISE_INFO: Readonly<Record<ExerciseType, { readonly title: string; readonly area: string }>> = {
  'taper-depth': { title: 'Depth to stop on an angle block', area: 'Taper planner' },
  'taper-end-thickness': { title: 'End thickness of a milled taper', area: 'Taper planner' },
  'taper-angle': { title: 'Taper angle from the drawing', area: 'Taper planner' },
  'sine-stack': { title: 'Sine-bar stack for an angle', area: 'Sine bar & plate' },
  'sine-angle': { title: 'Angle from a sine-bar stack', area: 'Sine bar & plate' },
  'gauge-fewest': { title: 'Fewest gauge blocks for a stack', area: 'Gauge blocks' },
  'lathe-half-angle': { title: 'Compound setting for a taper per foot', area: 'Lathe tapers' },
  'lathe-offset': { title: 'Tail-stock offset', area: 'Lathe tapers' },
  'dovetail-pins': { title: 'Dovetail measured over pins', area: 'Pins & rolls' },
};

/** Whether a value names an exercise type. */
export function isExerciseType(value: unknown): value is ExerciseType {
  return typeof value === 'string' && (EXERCISE_TYPES as readonly string[]).includes(value);
}
