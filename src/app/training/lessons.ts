import type { ExerciseType } from '../../../shared/training/exercise-types';

/** Which interactive drawing a lesson is built on. */
export type LessonDrawingKind = 'taper-triangle' | 'sine-bar' | 'gauge-stack' | 'lathe-taper' | 'over-pins';

/** One short lesson of the course. */
export interface Lesson {
  slug: string;
  title: string;
  /** One line for the lesson list. */
  summary: string;
  drawing: LessonDrawingKind;
  /** What to do with the drawing's slider. */
  tryIt: string;
  sections: ReadonlyArray<{ heading: string; paragraphs: readonly string[] }>;
  /** Exercise types of the practice problems at the end. */
  practice: readonly ExerciseType[];
  /** Safety notes where the lesson's work can hurt someone (with their sources). */
  cautions: readonly string[];
  /** Heading of the notes for a lesson that measures rather than cuts (else "Before you clamp and cut"). */
  cautionHeading?: string;
}

const CLAMP_AND_STOP =
  'Clamp the work and the block before the table moves toward the cutter; measure and adjust only with the spindle stopped (Michigan Admin. Code R 408.12640 "Milling").';
const CLEAN_BLOCKS =
  'Check gauge blocks for nicks and burrs before wringing, keep fingers off the gauging faces, and do not leave a stack wrung overnight (Starrett-Webber "Use and Care" GB45).';
const CLEAN_TAPERS = 'Keep tapers free of dirt, chips, nicks and burrs, and wipe off oil: an oily taper will not hold (US Army OD1645).';

/** The apprentice course "Angles on the mill": five lessons, each ending in practice problems. */
export const LESSONS: readonly Lesson[] = [
  {
    slug: 'right-triangle',
    title: 'The right triangle on a taper set-up',
    summary: 'Where sin, cos and tan hide when a part lies tilted on an angle block.',
    drawing: 'taper-triangle',
    tryIt: 'Drag the round handle at the end of the top face (or move the angle slider). The part tilts on its block; the shaded triangle is the stock the level cut takes off.',
    sections: [
      {
        heading: 'Find the triangle first',
        paragraphs: [
          'Tilt a part on an angle block and the taper face you want becomes level, so the cutter can sweep it flat. Between the top face of the part and that level cut there is a thin wedge of metal. Look at it end-on and it is a right triangle.',
          'Its long flat side runs along the top face: that is the taper length L, measured from the end to where the taper starts. Its short side stands at the end of the part, square to the top face: that is the stock d the cut takes off there. The slanted side is the new face itself, the face length F that a scale reads along the slope.',
        ],
      },
      {
        heading: 'Name the sides from the angle',
        paragraphs: [
          'Stand at the corner where the taper starts; the angle α is there. The side across from you is the opposite (d). The side you stand on, not the slanted one, is the adjacent (L). The slanted one is the hypotenuse (F).',
          'Then tan α = opposite / adjacent = d / L, sin α = opposite / hypotenuse = d / F, and cos α = adjacent / hypotenuse = L / F. Pick the one that holds the two things you know and the one you want.',
        ],
      },
      {
        heading: 'Depth to stop',
        paragraphs: [
          'With the face level, you touch off on the highest corner (the top edge at the end of the part) and feed down. The cut is done when the cutter reaches the level of the taper start. That vertical drop is h = L · sin α: the top face is tilted by α, so its end sits L · sin α above the start.',
          'Note that h (what the quill or knee travels) and d (what the micrometer sees gone from the end) differ: d = L · tan α is measured square to the part, h straight down. They differ by the factor cos α.',
        ],
      },
    ],
    practice: ['taper-depth', 'taper-end-thickness', 'taper-angle'],
    cautions: [CLAMP_AND_STOP, 'Take light cuts on a tilted set-up and deburr the sharp edge a taper leaves.'],
  },
  {
    slug: 'sine-bar',
    title: 'Why the sine bar works',
    summary: 'A bar, two rolls and a stack of blocks make any angle you can compute.',
    drawing: 'sine-bar',
    tryIt: 'Drag the handle on the raised roll (or move the angle slider): the stack under the right-hand roll grows as L · sin θ. Watch how much it changes for each degree near 0° and how little near 60°: at steep angles a small error in the stack moves the angle more (Δθ = ΔH / (L · cos θ)), which is why steep angles are better set from the other side, at 90° − θ.',
    sections: [
      {
        heading: 'The bar is a hypotenuse you can trust',
        paragraphs: [
          'A sine bar is a hardened bar with two rolls of equal size whose centres are a known distance L apart — 5 in, 10 in, 100 mm. Set one roll on the surface plate and lift the other on gauge blocks, and the bar\u2019s top face tilts.',
          'The roll centres and the point on the plate under the raised roll make a right triangle. The bar is its hypotenuse (L), the stack is the opposite side (H). So sin θ = H / L, and the stack you need is H = L · sin θ.',
        ],
      },
      {
        heading: 'Why it is so accurate',
        paragraphs: [
          'L is made to a fraction of a thousandth and gauge blocks step in tenths of a thousandth, so the angle is set as closely as a stack can be built. Because the rolls are equal, their size drops out: only the centre distance matters.',
          'The angle is least sensitive near 0° and more sensitive as it climbs: a small error in the stack turns into an angle error of about ΔH / (L · cos θ). Past about 45° a steep angle is better set as its complement against a square or angle plate.',
        ],
      },
    ],
    practice: ['sine-stack', 'sine-angle'],
    cautions: ['Sine bar, blocks and plate must be clean: one chip under a roll or between blocks tilts the whole set-up (Sparber; US Army OD1642).', CLEAN_BLOCKS],
    cautionHeading: 'Care of the bar and blocks',
  },
  {
    slug: 'gauge-stack',
    title: 'Building a gauge stack, and why fewest blocks',
    summary: 'Clear the last digit first, and use as few blocks as the length allows.',
    drawing: 'gauge-stack',
    tryIt: 'Move the length slider. The left stack is the fewest blocks from the 81-piece set; the right one is the by-hand last-digit method.',
    sections: [
      {
        heading: 'Clear the digits from the right',
        paragraphs: [
          'To build 2.8260 in from an 81-piece inch set, work from the smallest decimal place. Take a block that clears the last digit, subtract, and repeat with what is left: the remainder shrinks to a length the big blocks can finish.',
          'That by-hand method always gets there, but not always with the fewest blocks. Slantwise searches every combination in the box to find the shortest stack.',
        ],
      },
      {
        heading: 'Why fewer is better',
        paragraphs: [
          'Every block carries its own small size error, and every wrung joint adds a film. Fewer blocks means fewer errors to add up and fewer faces to clean, wring and wear.',
          'Use the thickest blocks the length allows and vary your choices over time so the same few blocks do not wear first.',
        ],
      },
    ],
    practice: ['gauge-fewest', 'sine-stack'],
    cautions: [CLEAN_BLOCKS, 'Let blocks settle to room temperature after handling; lengths are defined at 20 °C (ISO 1).'],
    cautionHeading: 'Care of the blocks',
  },
  {
    slug: 'taper-per-foot',
    title: 'Taper per foot and the compound angle',
    summary: 'From a drawing\u2019s taper per foot to the angle you set on the lathe\u2019s compound.',
    drawing: 'lathe-taper',
    tryIt: 'Move the taper-per-foot slider. The drawing exaggerates the angle so small tapers show; the numbers are exact.',
    sections: [
      {
        heading: 'Taper per foot is a change in diameter',
        paragraphs: [
          'A taper per foot (TPF) says how much the diameter shrinks over 12 inches of length. Half of that change happens on each side of the centre line, so over 12 in one side drops TPF / 2.',
          'That gives a right triangle on one side of the work: 12 in along the axis, TPF / 2 across. The angle of the side to the axis is the half angle: tan(α/2) = (TPF / 2) / 12 = TPF / 24.',
        ],
      },
      {
        heading: 'What you set on the machine',
        paragraphs: [
          'The compound rest swings from the axis, so you set it to the half angle α/2 = atan(TPF / 24), not to the included angle. The included angle of the whole cone is twice that.',
          'For a long taper you may offset the tail stock instead: over the whole work length L it must move TPF · L / 24, half the diameter change the full length would make.',
        ],
      },
    ],
    practice: ['lathe-half-angle', 'lathe-offset'],
    cautions: [CLEAN_TAPERS, 'After turning a taper with the tail stock offset, set it back on centre and check it before the next job (US Navy training manual).'],
  },
  {
    slug: 'over-pins',
    title: 'Measuring over pins',
    summary: 'Why a dovetail is measured over two rolls, and the constant that turns the reading into a width.',
    drawing: 'over-pins',
    tryIt: 'Drag the handle on the flank (or move the angle slider): as the dovetail angle closes, each pin sits farther out of the corner and the reading grows.',
    sections: [
      {
        heading: 'A sharp corner cannot be measured',
        paragraphs: [
          'The width of a dovetail is defined at sharp corners that a micrometer cannot touch. Lay an accurate roll in each corner and measure over the rolls instead: the rolls touch the flank and the base at known places.',
          'Each roll\u2019s centre sits on the bisector of the corner angle. Half the angle, the roll\u2019s radius and the distance along the base make a right triangle: the roll\u2019s edge lies r · cot(α/2) + r beyond the sharp corner.',
        ],
      },
      {
        heading: 'The roll constant',
        paragraphs: [
          'Both sides together add D · (1 + cot(α/2)) to the sharp-corner width a, where D is the roll diameter: x = a + D · (1 + cot(α/2)). For a 60° dovetail the constant 1 + cot 30° is 2.7321.',
          'Choose a roll small enough to touch the flank below its top edge, and measure with the work clean and deburred.',
        ],
      },
    ],
    practice: ['dovetail-pins'],
    cautions: ['Deburr the dovetail before measuring and keep fingers clear of the sharp edges; measure only with the machine stopped (US Army TM 1-1500-204-23-8).'],
    cautionHeading: 'Before you measure',
  },
];

/** The lesson with the given slug, if any. */
export function findLesson(slug: string | undefined): Lesson | undefined {
  return LESSONS.find((l) => l.slug === slug);
}
