/** One first-class area of Slantwise, as the navigation and the home page show it. */
export interface Area {
  /** Route path without the leading slash. */
  readonly path: string;
  /** Short name in the navigation. */
  readonly label: string;
  /** Material Symbols ligature. */
  readonly icon: string;
  /** One or two sentences for the home page. */
  readonly summary: string;
  /** Whether the area stores data and so needs a signed-in user. */
  readonly needsSignIn: boolean;
}

/** Every area of the app, in navigation order: calculators first, then the stored work. */
export const AREAS: readonly Area[] = [
  {
    path: 'taper', label: 'Taper planner', icon: 'square_foot', needsSignIn: false,
    summary: 'Tapers, bevels and chamfers on the mill: the depth to stop from the touch-off point, the end thickness, face length and passes, drawn on the set-up.',
  },
  {
    path: 'sine-bar', label: 'Sine bar & plate', icon: 'straighten', needsSignIn: false,
    summary: 'Gauge-block stack height for an angle and the angle a stack gives, for any bar length, with the angle error and a printable table.',
  },
  {
    path: 'gauge-blocks', label: 'Gauge blocks', icon: 'stacks', needsSignIn: false,
    summary: 'The stack with the fewest blocks from what is really in the box, in wringing order, with its tolerance and temperature change.',
  },
  {
    path: 'angle-blocks', label: 'Angle blocks', icon: 'change_history', needsSignIn: false,
    summary: 'The fewest angle blocks, added or reversed, that make a wanted angle, and the angle a combination makes.',
  },
  {
    path: 'lathe-tapers', label: 'Lathe tapers', icon: 'rotate_right', needsSignIn: false,
    summary: 'Taper per foot, included and half angle for the compound, tail-stock offset and diameters along the taper.',
  },
  {
    path: 'pins-rolls', label: 'Pins & rolls', icon: 'adjust', needsSignIn: false,
    summary: 'Measurement over pins or rolls for dovetails and V-grooves, and the reading to stop at.',
  },
  {
    path: 'batches', label: 'Batch runs', icon: 'checklist', needsSignIn: true,
    summary: 'Run a saved set-up on every part of a batch: readings, checks against tolerance and the spread from the first part.',
  },
  {
    path: 'library', label: 'Set-up library', icon: 'library_books', needsSignIn: true,
    summary: 'The team’s saved set-ups with drawings, photos and notes, released by a lead and printed as set-up sheets.',
  },
  {
    path: 'training', label: 'Training', icon: 'school', needsSignIn: true,
    summary: 'Lessons and exercises on the right-triangle trig behind every set-up, with worked solutions and assignments.',
  },
  {
    path: 'team', label: 'Team', icon: 'groups', needsSignIn: true,
    summary: 'Members, roles and invitations, and the shop’s gauge-block and angle-block inventories.',
  },
];
