/**
 * The set-up sheet's type: IBM Plex Sans, the app's own font, embedded from the files shipped with
 * it (@fontsource/ibm-plex-sans). The font comes in parts by script (Latin, Latin Extended,
 * Greek, Cyrillic, Vietnamese), so a line is written as runs, each in the part that has its
 * characters: a name in Polish, Czech, Greek or Russian prints as typed. A few mathematical signs
 * no part has are spelled out (≤ as <=, √ as sqrt), and anything else — Chinese, emoji — as "?".
 */
import { createRequire } from 'node:module';
import path from 'node:path';

/** The parts of the font, in the order a character is looked for (the first that has it is used). */
const SUBSETS = ['latin', 'latin-ext', 'greek', 'cyrillic', 'cyrillic-ext', 'vietnamese'] as const;
type Subset = (typeof SUBSETS)[number];

/** The weights the sheet uses: regular text, and semibold for titles, headings and labels. */
export type SheetWeight = 'regular' | 'bold';
const WEIGHTS: Record<SheetWeight, number> = { regular: 400, bold: 600 };

const load = createRequire(__filename);
const fontDir = path.join(path.dirname(load.resolve('@fontsource/ibm-plex-sans/package.json')), 'files');
/** Each part's characters, as the font package lists them ("U+0000-00FF,U+0131,…"). */
const RANGES: Record<Subset, Array<[number, number]>> = (() => {
  const listed = load('@fontsource/ibm-plex-sans/unicode.json') as Record<string, string>;
  const out = {} as Record<Subset, Array<[number, number]>>;
  for (const subset of SUBSETS) {
    out[subset] = (listed[subset] ?? '').split(',').map((r) => {
      const [a, b] = r.replace(/U\+/g, '').split('-');
      return [parseInt(a!, 16), parseInt(b ?? a!, 16)] as [number, number];
    });
  }
  return out;
})();

/** The font part that has a character, or null. */
function subsetOf(ch: string): Subset | null {
  const cp = ch.codePointAt(0)!;
  return SUBSETS.find((s) => RANGES[s].some(([a, b]) => cp >= a && cp <= b)) ?? null;
}

/** The name a part of the font is registered under in a document. */
function fontName(subset: Subset, weight: SheetWeight): string {
  return `plex-${subset}-${WEIGHTS[weight]}`;
}

/** Registers every part of the font in both weights (each is embedded only if the sheet uses it). */
export function registerSheetFonts(doc: PDFKit.PDFDocument): void {
  for (const subset of SUBSETS) {
    for (const weight of Object.keys(WEIGHTS) as SheetWeight[]) {
      doc.registerFont(fontName(subset, weight), path.join(fontDir, `ibm-plex-sans-${subset}-${WEIGHTS[weight]}-normal.woff`));
    }
  }
}

// Signs the font does not have, spelled as a machinist would write them.
const STAND_INS: Record<string, string> = {
  '√': 'sqrt', '≤': '<=', '≥': '>=', '≈': '~', '⟂': 'perp.', '→': '->', '∠': 'angle ', '⋅': '·', '∑': 'sum', '⌈': 'ceil(', '⌉': ')',
  '⌊': 'floor(', '⌋': ')', '↔': '<->', '≡': '==', '≠': '!=', '∞': 'infinity',
  '₀': '0', '₁': '1', '₂': '2', '₃': '3', '₄': '4', '₅': '5', '₆': '6', '₇': '7', '₈': '8', '₉': '9',
};

/** Superscripts: a run the font cannot print (10⁻⁶) is written after a caret (10^-6); ¹ ² ³ print as they are. */
const SUPERSCRIPTS: Record<string, string> = { '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9', '⁻': '-', '⁺': '+', 'ⁿ': 'n' };

/** Text the sheet's font can print: signs it lacks spelled out, anything else it lacks as "?". */
export function pdfText(text: string): string {
  let out = '';
  const chars = [...text];
  for (let i = 0; i < chars.length; i += 1) {
    const ch = chars[i]!;
    if (SUPERSCRIPTS[ch] !== undefined) {
      let end = i;
      while (end < chars.length && SUPERSCRIPTS[chars[end]!] !== undefined) end += 1;
      const run = chars.slice(i, end);
      out += run.every((c) => subsetOf(c) !== null) ? run.join('') : `^${run.map((c) => SUPERSCRIPTS[c]).join('')}`;
      i = end - 1;
      continue;
    }
    // Line breaks and tabs are laid out by the text itself, not printed.
    if (ch === '\n' || ch === '\t' || subsetOf(ch) !== null) out += ch;
    else out += STAND_INS[ch] ?? '?';
  }
  return out;
}

/** One run of text in one part of the font. */
export interface FontRun {
  font: string;
  text: string;
}

/** The text (made printable) split into runs, each in the part of the font that has its characters. */
export function fontRuns(text: string, weight: SheetWeight): FontRun[] {
  const runs: FontRun[] = [];
  for (const ch of pdfText(text)) {
    // Each character strictly in its own part (a part's file can fail on a character it was not cut for).
    const font = fontName(subsetOf(ch) ?? 'latin', weight);
    const last = runs[runs.length - 1];
    if (last?.font === font) last.text += ch;
    else runs.push({ font, text: ch });
  }
  return runs.length ? runs : [{ font: fontName('latin', weight), text: '' }];
}

/** The font a piece of text in a weight starts in (to select it before measuring or drawing). */
export function baseFont(weight: SheetWeight): string {
  return fontName('latin', weight);
}
