/**
 * Reads the text drawn in an uncompressed PDF (the set-up sheets are written uncompressed): the
 * strings of the TJ/Tj operators, decoded through the font each is drawn in — an embedded font
 * (Type0, two-byte glyph codes) through its ToUnicode map, a standard font as Windows-1252.
 */
const CP1252: Record<number, string> = { 0x80: '€', 0x91: '‘', 0x92: '’', 0x93: '“', 0x94: '”', 0x95: '•', 0x96: '–', 0x97: '—', 0x85: '…' };

function decode1252(bytes: number[]): string {
  return bytes.map((b) => CP1252[b] ?? String.fromCharCode(b)).join('');
}

/** UTF-16BE written as hex ("00410042", surrogate pairs as two units) → text. */
function utf16(hex: string): string {
  const units: number[] = [];
  for (let i = 0; i + 4 <= hex.length; i += 4) units.push(parseInt(hex.slice(i, i + 4), 16));
  return String.fromCharCode(...units);
}

/** A ToUnicode CMap's bfchar and bfrange entries: glyph code → text. */
function readCMap(cmap: string): Map<number, string> {
  const map = new Map<number, string>();
  for (const block of cmap.matchAll(/beginbfchar([\s\S]*?)endbfchar/g)) {
    for (const m of (block[1] ?? '').matchAll(/<([0-9a-fA-F]+)>\s*<([0-9a-fA-F\s]+)>/g)) map.set(parseInt(m[1]!, 16), utf16(m[2]!.replace(/\s/g, '')));
  }
  for (const block of cmap.matchAll(/beginbfrange([\s\S]*?)endbfrange/g)) {
    for (const m of (block[1] ?? '').matchAll(/<([0-9a-fA-F]+)>\s*<([0-9a-fA-F]+)>\s*(\[[^\]]*\]|<[0-9a-fA-F\s]+>)/g)) {
      const start = parseInt(m[1]!, 16);
      const end = parseInt(m[2]!, 16);
      const target = m[3]!;
      if (target.startsWith('[')) {
        [...target.matchAll(/<([0-9a-fA-F\s]*)>/g)].forEach((t, i) => map.set(start + i, utf16(t[1]!.replace(/\s/g, ''))));
      } else {
        const first = target.replace(/[<>\s]/g, '');
        const base = parseInt(first.slice(-4), 16);
        for (let code = start; code <= end; code += 1) map.set(code, utf16(first.slice(0, -4) + (base + code - start).toString(16).padStart(4, '0')));
      }
    }
  }
  return map;
}

/** Each font resource name (F1, F2 …) with the ToUnicode map of an embedded font, or null for a standard font. */
function fontsOf(source: string): Map<string, Map<number, string> | null> {
  const objects = new Map<string, string>();
  for (const m of source.matchAll(/(\d+) 0 obj\s*([\s\S]*?)endobj/g)) objects.set(m[1]!, m[2]!);
  const fonts = new Map<string, Map<number, string> | null>();
  for (const dict of source.matchAll(/\/Font\s*<<([^>]*)>>/g)) {
    for (const ref of (dict[1] ?? '').matchAll(/\/([A-Za-z0-9_.-]+)\s+(\d+)\s+0\s+R/g)) {
      if (fonts.has(ref[1]!)) continue;
      const font = objects.get(ref[2]!) ?? '';
      const toUnicode = /\/Subtype\s*\/Type0[\s\S]*?\/ToUnicode\s+(\d+)\s+0\s+R|\/ToUnicode\s+(\d+)\s+0\s+R[\s\S]*?\/Subtype\s*\/Type0/.exec(font);
      const cmapObject = toUnicode ? objects.get(toUnicode[1] ?? toUnicode[2]!) : undefined;
      const stream = cmapObject ? /stream\r?\n([\s\S]*?)\r?\nendstream/.exec(cmapObject)?.[1] : undefined;
      fonts.set(ref[1]!, stream !== undefined ? readCMap(stream) : null);
    }
  }
  return fonts;
}

/** One string drawn: its text, the font resource it was drawn in, and where its line starts. */
interface Drawn {
  text: string;
  font: string;
  x: number;
  y: number;
}

/** Every BT…ET text object of the PDF, in stream order. */
function drawn(pdf: Buffer): Drawn[] {
  const source = pdf.toString('latin1');
  const fonts = fontsOf(source);
  const out: Drawn[] = [];
  let font = '';
  for (const block of source.matchAll(/BT([\s\S]*?)ET/g)) {
    let text = '';
    let x = NaN;
    let y = NaN;
    const ops = /([-\d.]+)\s+([-\d.]+)\s+([-\d.]+)\s+([-\d.]+)\s+([-\d.]+)\s+([-\d.]+)\s+Tm|\/([A-Za-z0-9_.-]+)\s+[\d.]+\s+Tf|\[((?:[^\]\\]|\\.)*)\]\s*TJ|(<[0-9a-fA-F\s]*>|\((?:[^)\\]|\\.)*\))\s*Tj/g;
    for (const op of (block[1] ?? '').matchAll(ops)) {
      if (op[6] !== undefined) {
        x = Number(op[5]);
        y = Number(op[6]);
        continue;
      }
      if (op[7] !== undefined) {
        font = op[7];
        continue;
      }
      const cmap = fonts.get(font) ?? null;
      const body = op[8] ?? op[9] ?? '';
      for (const s of body.matchAll(/<([0-9a-fA-F\s]*)>|\(((?:[^)\\]|\\.)*)\)/g)) {
        if (s[1] !== undefined) {
          const hex = s[1].replace(/\s/g, '');
          if (cmap) {
            for (let i = 0; i + 4 <= hex.length; i += 4) text += cmap.get(parseInt(hex.slice(i, i + 4), 16)) ?? '\uFFFD';
          } else {
            const bytes: number[] = [];
            for (let i = 0; i < hex.length; i += 2) bytes.push(parseInt(hex.slice(i, i + 2).padEnd(2, '0'), 16));
            text += decode1252(bytes);
          }
        } else if (s[2] !== undefined) {
          text += decode1252([...s[2].replace(/\\([()\\])/g, '$1')].map((c) => c.charCodeAt(0)));
        }
      }
    }
    out.push({ text, font, x, y });
  }
  return out;
}

/**
 * The text of the PDF, one string per line of text written: the pieces of one line drawn in
 * different fonts (a name with letters from two parts of a font, a bold label and its value) are
 * joined as one string; separate pieces in the same font are separate strings.
 */
export function pdfTextRuns(pdf: Buffer): string[] {
  const runs: string[] = [];
  let last: Drawn | null = null;
  for (const d of drawn(pdf)) {
    if (last && d.y === last.y && d.x > last.x && d.font !== last.font) runs[runs.length - 1] += d.text;
    else runs.push(d.text);
    last = d;
  }
  return runs;
}

/** The whole text of the PDF as one string (runs joined by newlines). */
export function pdfText(pdf: Buffer): string {
  return pdfTextRuns(pdf).join('\n');
}
