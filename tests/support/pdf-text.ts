/**
 * Reads the text drawn in an uncompressed PDF (the set-up sheets are written uncompressed):
 * the hex and literal strings of TJ/Tj operators, decoded as Windows-1252 (the standard fonts).
 */
const CP1252: Record<number, string> = { 0x80: '€', 0x91: '‘', 0x92: '’', 0x93: '“', 0x94: '”', 0x95: '•', 0x96: '–', 0x97: '—', 0x85: '…' };

function decode(bytes: number[]): string {
  return bytes.map((b) => CP1252[b] ?? String.fromCharCode(b)).join('');
}

/** All text of the PDF's text objects, one string per BT…ET block, in stream order. */
export function pdfTextRuns(pdf: Buffer): string[] {
  const source = pdf.toString('latin1');
  const runs: string[] = [];
  for (const block of source.matchAll(/BT([\s\S]*?)ET/g)) {
    let text = '';
    for (const op of (block[1] ?? '').matchAll(/\[((?:[^\]\\]|\\.)*)\]\s*TJ|(<[0-9a-fA-F\s]*>|\((?:[^)\\]|\\.)*\))\s*Tj/g)) {
      const body = op[1] ?? op[2] ?? '';
      for (const s of body.matchAll(/<([0-9a-fA-F\s]*)>|\(((?:[^)\\]|\\.)*)\)/g)) {
        if (s[1] !== undefined) {
          const hex = s[1].replace(/\s/g, '');
          const bytes: number[] = [];
          for (let i = 0; i < hex.length; i += 2) bytes.push(parseInt(hex.slice(i, i + 2).padEnd(2, '0'), 16));
          text += decode(bytes);
        } else if (s[2] !== undefined) {
          text += decode([...s[2].replace(/\\([()\\])/g, '$1')].map((c) => c.charCodeAt(0)));
        }
      }
    }
    runs.push(text);
  }
  return runs;
}

/** The whole text of the PDF as one string (runs joined by newlines). */
export function pdfText(pdf: Buffer): string {
  return pdfTextRuns(pdf).join('\n');
}
