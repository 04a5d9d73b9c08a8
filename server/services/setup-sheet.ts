import PDFDocument from 'pdfkit';
import { parseAngle } from '../../shared/angle/angle-text';
import type { Attachment } from '../models/attachment';
import type { Setup } from '../models/setup';
import { inputRows, setupResults, type SetupResults } from '../../shared/library/setup-results';
import { angleBlocksSketch, angleSketch, dovetailAngleSketch, dovetailSketch, vGrooveSketch, gaugeStackSketch, latheTaperSketch, sineBarSketch, taperBallsSketch, taperDiscsSketch, taperSketch, taperTwoHeightsSketch, type Sketch, type SketchShape, type TaperSketchHolding } from './sheet-drawing';
import type { ObjectStorage } from './storage/object-storage';
import type { TeamBoxes } from '../../shared/library/team-boxes';
import { kindLabel } from '../../shared/api/setup';
import { baseFont, fontRuns, registerSheetFonts, type SheetWeight } from './sheet-fonts';

/** What a set-up sheet is made from. */
export interface SheetSource {
  setup: Setup;
  attachments: readonly Attachment[];
  storage: ObjectStorage;
  /** Address of the set-up in the app, printed and linked at the foot of the sheet. */
  link: string;
  /** The team box the set-up names, loaded with what is in it now (none: answered on its page only). */
  boxes?: TeamBoxes;
}

/** General cautions printed on every sheet (common practice; defer to shop rules). */
const SHEET_CAUTIONS: ReadonlyArray<{ text: string; topic: RegExp; cutting?: true }> = [
  { text: 'Clamp the work and any angle block, sine plate or vise securely before cutting; measure only with the spindle stopped.', topic: /\bclamp/i, cutting: true },
  { text: 'Wear eye protection and keep guards in place; deburr sharp edges after the cut.', topic: /eye protection|safety glasses/i, cutting: true },
  // Always printed: the sheet's own word that it does not replace them.
  { text: 'Your shop rules, local regulations and the machine maker\'s instructions come first; this sheet does not replace them.', topic: /$^/ },
];

/** Set-ups that only measure or build a stack: the cutting cautions are not theirs. */
const MEASURING_KINDS = new Set(['gauge-blocks']);

/**
 * The sheet's cautions: the calculation's own, then each general one whose topic they do not
 * already cover (the cutting ones only for set-ups that cut).
 */
export function sheetCautions(kind: string, own: readonly string[]): string[] {
  const general = SHEET_CAUTIONS.filter((c) => !(c.cutting && MEASURING_KINDS.has(kind)) && !own.some((o) => c.topic.test(o)));
  return [...own, ...general.map((c) => c.text)];
}

const INK = '#1d2a33';
const MUTED = '#5b6b75';
const ACCENT = '#1f6f8b';

/** How a piece of text is written: its weight, and pdfkit's own text options. */
interface WriteOptions extends PDFKit.Mixins.TextOptions {
  weight?: SheetWeight;
}

/** The width of text in the sheet's font at the current size. */
function widthOf(doc: PDFKit.PDFDocument, text: string, weight: SheetWeight = 'regular'): number {
  const width = fontRuns(text, weight).reduce((sum, run) => sum + doc.font(run.font).widthOfString(run.text), 0);
  doc.font(baseFont('regular'));
  return width;
}

/**
 * Writes text in the sheet's font, at (x, y) when given, else where the last text left off: each
 * run in the part of the font that has its characters, continued so the runs wrap as one text.
 */
function write(doc: PDFKit.PDFDocument, text: string, options: WriteOptions = {}, at?: readonly [number, number]): void {
  const { weight = 'regular', ...rest } = options;
  const runs = fontRuns(text, weight);
  runs.forEach((run, i) => {
    const continued = i < runs.length - 1 || rest.continued === true;
    doc.font(run.font);
    if (i === 0 && at) doc.text(run.text, at[0], at[1], { ...rest, continued });
    else doc.text(run.text, { ...rest, continued });
  });
  doc.font(baseFont('regular'));
}

function num(value: unknown): number | null {
  if (typeof value === 'number') return Number.isFinite(value) ? value : null;
  if (typeof value === 'string' && /^-?\d+(\.\d+)?$/.test(value.trim())) return Number(value);
  return null;
}

function angleOf(value: unknown): number | null {
  const parsed = parseAngle(value);
  return parsed.ok ? parsed.degrees.toNumber() : null;
}

/** The sketch that fits the set-up's kind, from the engine's answer where there is one. */
export function sketchFor(kind: string, saved: Record<string, unknown>, results: SetupResults): Sketch | null {
  const v = results.ok ? results.value : {};
  // The figures the engine was given (a pins-and-rolls form saved from its page, as the page sends it).
  const inputs = results.ok ? results.input : saved;
  if (kind === 'taper') {
    const T = num(v['thickness']) ?? num(inputs['thickness']);
    const L = num(v['taperLength']) ?? num(inputs['taperLength']);
    const a = num(v['angleDeg']) ?? angleOf(inputs['angle']);
    const drawing = results.ok && results.holding?.ok ? results.holding.plan.drawing : null;
    const holding: TaperSketchHolding =
      drawing?.kind === 'sine-plate' && drawing.plateLength > 0
        ? { kind: 'sine-plate', plateLength: drawing.plateLength, stackLabel: drawing.stackLabel.replace(/ stack$/, '') }
        : drawing?.kind === 'tilted-vise' ? { kind: 'tilted-vise' } : { kind: 'angle-block' };
    if (T && L && a && a > 0 && a < 90) return taperSketch(T, L, a, `${String(v['depthToStop'] ?? '')} ${String(v['unit'] ?? inputs['unit'] ?? '')}`.trim(), holding);
  }
  if (kind === 'sine-bar') {
    const L = num(v['barLength']) ?? num(inputs['barLength']);
    const a = num(v['angleDeg']) ?? angleOf(inputs['angle']);
    if (L && a !== null && a >= 0 && a < 90) return sineBarSketch(L, a, `${String(v['stackHeight'] ?? '')} ${String(v['unit'] ?? '')}`.trim());
  }
  if (kind === 'gauge-blocks' && Array.isArray(v['blocks']) && v['blocks'].length > 0) {
    // Sizes from `blocks`; a wear block named as the answer names it (`labels`).
    const labels = Array.isArray(v['labels']) ? v['labels'].map(String) : undefined;
    return gaugeStackSketch(v['blocks'].map(String), `${String(v['total'] ?? '')} ${String(v['unit'] ?? '')}`.trim(), labels);
  }
  if (kind === 'angle-blocks' && Array.isArray(v['blocks']) && v['blocks'].length > 0) {
    const blocks = (v['blocks'] as Array<Record<string, unknown>>).map((b) => ({ angleDeg: num(b['angleDeg']) ?? 0, label: String(b['angle'] ?? ''), reversed: b['direction'] === 'reverse' }));
    return angleBlocksSketch(blocks, String(v['achievedAngleDms'] ?? ''));
  }
  if (kind === 'pins-rolls' && v['kind'] === 'dovetail' && (inputs['side'] === 'male' || inputs['side'] === 'female')) {
    const values = (v['values'] ?? {}) as Record<string, unknown>;
    const W = num(values['width']);
    const a = num(values['angleDeg']);
    const D = num(inputs['rollDiameter']);
    if (W && a && D && a > 0 && a < 90) return dovetailSketch(inputs['side'], W, a, D, num(inputs['depth']), `${String(values['measurement'] ?? '')} ${String(v['unit'] ?? '')}`.trim());
  }
  if (kind === 'pins-rolls' && v['kind'] === 'v-groove') {
    const values = (v['values'] ?? {}) as Record<string, unknown>;
    const W = num(values['grooveWidth']);
    const a = num(values['includedAngleDeg']);
    const D = num(inputs['pinDiameter']);
    if (W && a && D && a > 0 && a < 180) return vGrooveSketch(W, a, D, `${String(values['measurement'] ?? '')} ${String(v['unit'] ?? '')}`.trim());
  }
  if (kind === 'pins-rolls' && ['dovetail-angle', 'taper-two-heights', 'taper-discs', 'taper-balls'].includes(String(v['kind']))) {
    // Lengths as set up or as the engine printed them, with the unit; angles as the engine's DMS.
    const values = (v['values'] ?? {}) as Record<string, unknown>;
    const dms = (v['dms'] ?? {}) as Record<string, unknown>;
    const unit = String(v['unit'] ?? inputs['unit'] ?? '');
    const given = (key: string) => `${String(inputs[key] ?? '')} ${unit}`.trim();
    const tpf = values['taperPerFoot'] !== undefined ? `, TPF ${String(values['taperPerFoot'])} in/ft` : '';
    const included = `α ${String(dms['includedAngleDeg'] ?? '')}${tpf}`;
    let sketch: Sketch | null = null;
    if (v['kind'] === 'dovetail-angle' && (inputs['side'] === 'male' || inputs['side'] === 'female')) {
      const [D1, M1, D2, M2] = ['rollDiameter1', 'measurement1', 'rollDiameter2', 'measurement2'].map((k) => num(inputs[k]));
      const over = inputs['side'] === 'male' ? 'over' : 'between';
      if (D1 && M1 && D2 && M2) {
        sketch = dovetailAngleSketch(inputs['side'], D1, M1, D2, M2, {
          reading1: `M1 ${given('measurement1')} ${over} ${String(inputs['rollDiameter1'])} rolls`,
          reading2: `M2 ${given('measurement2')} ${over} ${String(inputs['rollDiameter2'])} rolls`,
          width: `${inputs['side'] === 'male' ? 'a' : 'b'} ${String(values['width'] ?? '')} ${unit}`,
          angle: `α ${String(dms['angleDeg'] ?? '')}`,
        });
      }
    } else if (v['kind'] === 'taper-two-heights') {
      const [M1, M2, dH] = ['measurement1', 'measurement2', 'heightDifference'].map((k) => num(inputs[k]));
      if (M1 && M2 && dH) sketch = taperTwoHeightsSketch(M1, M2, dH, { reading1: `M1 ${given('measurement1')}`, reading2: `M2 ${given('measurement2')}`, height: `ΔH ${given('heightDifference')}`, halfAngle: `α/2 ${String(dms['halfAngleDeg'] ?? '')}`, included });
    } else if (v['kind'] === 'taper-discs') {
      const [D, d, C] = [num(inputs['largeDisc']), num(inputs['smallDisc']), num(values['centreDistance'])];
      if (D && d && C) sketch = taperDiscsSketch(inputs['reference'] === 'side' ? 'side' : 'axis', D, d, C, { large: `D ${given('largeDisc')}`, small: `d ${given('smallDisc')}`, centres: `C ${String(values['centreDistance'])} ${unit}`, angle: included });
    } else if (v['kind'] === 'taper-balls') {
      const [D, d, h1, h2] = ['largeBall', 'smallBall', 'largeBallDepth', 'smallBallDepth'].map((k) => num(inputs[k]));
      if (D && d && h1 !== null && h1 !== undefined && h2 !== null && h2 !== undefined) {
        sketch = taperBallsSketch(D, d, h1, h2, {
          large: `D ${given('largeBall')}`,
          small: `d ${given('smallBall')}`,
          largeDepth: `h1 ${given('largeBallDepth')}`,
          smallDepth: `h2 ${given('smallBallDepth')}`,
          centres: `s ${String(values['centreDistance'] ?? '')} ${unit}`,
          halfAngle: `α/2 ${String(dms['halfAngleDeg'] ?? '')}`,
          included,
        });
      }
    }
    if (sketch) return sketch;
  }
  if (kind === 'lathe-taper') {
    const half = num(v['halfAngleDeg']);
    const length = num(v['length']);
    // Printed as the engine wrote it (to the unit's resolution), with its unit.
    const lengthLabel = length !== null ? `L ${String(v['length'])} ${String(v['unit'] ?? '')}`.trim() : undefined;
    if (half !== null && half > 0 && half < 45) return latheTaperSketch(half, String(v['halfAngleDms'] ?? `${half}°`), num(v['largeDiameter']), length, lengthLabel);
  }
  const a = num(v['angleDeg']) ?? num(v['includedAngleDeg']) ?? angleOf(inputs['angle']);
  return a !== null && a > 0 && a < 90 ? angleSketch(a, `${a}°`) : null;
}

function drawSketch(doc: PDFKit.PDFDocument, sketch: Sketch, x: number, y: number, w: number, h: number): void {
  const { minX, minY, maxX, maxY } = sketch.box;
  // The title takes the top line of the box (and a second, for a label written above a mark); the drawing fits below it.
  const title = sketch.shapes.some((s) => s.labelAbove) ? 28 : 16;
  const scale = Math.min(w / (maxX - minX || 1), (h - title) / (maxY - minY || 1)) * 0.9;
  const ox = x + (w - (maxX - minX) * scale) / 2;
  const oy = y + h - (h - title - (maxY - minY) * scale) / 2;
  const at = (p: { x: number; y: number }): [number, number] => [ox + (p.x - minX) * scale, oy - (p.y - minY) * scale];
  doc.save().lineWidth(0.8).rect(x, y, w, h).strokeColor('#c9d3d9').stroke().restore();
  const fills: Record<SketchShape['style'], [string, string]> = {
    part: ['#dfe9ee', INK], block: ['#c7cfd4', INK], removed: ['#f3c9a6', '#b65a1b'], cut: ['#ffffff', '#b65a1b'], tool: ['#ffffff', INK], mark: ['#ffffff', ACCENT],
  };
  for (const s of sketch.shapes) {
    const [fill, stroke] = fills[s.style];
    doc.save().lineWidth(1).strokeColor(stroke).fillColor(fill);
    if (s.kind === 'polygon') {
      const [first, ...rest] = s.points.map(at);
      if (first) {
        doc.moveTo(...first);
        for (const p of rest) doc.lineTo(...p);
        doc.closePath().fillAndStroke(fill, stroke);
      }
    } else if (s.kind === 'line') {
      const [a, b] = s.points.map(at);
      if (a && b) doc.dash(4, { space: 3 }).moveTo(...a).lineTo(...b).stroke().undash();
    } else if (s.kind === 'circle' && s.r) {
      const [c] = s.points.map(at);
      if (c) doc.circle(c[0], c[1], Math.max(2, s.r * scale)).fillAndStroke(fill, stroke);
    } else if (s.kind === 'dimension') {
      const [a, b] = s.points.map(at);
      if (a && b) {
        doc.moveTo(...a).lineTo(...b).stroke();
        for (const [p, q] of [[a, b], [b, a]] as const) {
          const ang = Math.atan2(q[1] - p[1], q[0] - p[0]);
          doc.moveTo(...p).lineTo(p[0] + 6 * Math.cos(ang + 0.4), p[1] + 6 * Math.sin(ang + 0.4)).moveTo(...p).lineTo(p[0] + 6 * Math.cos(ang - 0.4), p[1] + 6 * Math.sin(ang - 0.4)).stroke();
        }
      }
    }
    doc.restore();
    if (s.label && (s.kind === 'dimension' || s.kind === 'circle' || s.style === 'block' || s.labelAt)) {
      // A label goes where the shape says, else a dimension's at its middle and the rest at the first point.
      const p = s.labelAt
        ? at(s.labelAt)
        : s.kind === 'dimension'
          ? at({ x: ((s.points[0]?.x ?? 0) + (s.points[1]?.x ?? 0)) / 2, y: ((s.points[0]?.y ?? 0) + (s.points[1]?.y ?? 0)) / 2 })
          : at(s.points[0] ?? { x: 0, y: 0 });
      doc.fillColor(s.style === 'block' ? MUTED : ACCENT).fontSize(8);
      // Beside a circle, clear of its rim (or above it); beside anything else, just off the point.
      const rim = s.kind === 'circle' && s.r ? Math.max(2, s.r * scale) : 0;
      // A level dimension's figure sits above its line, centred.
      const [a, b] = s.points.map(at);
      const level = s.kind === 'dimension' && !s.labelAt && a && b && Math.abs(b[1] - a[1]) < Math.abs(b[0] - a[0]);
      const place: [number, number] = s.labelAbove
        ? [p[0] - widthOf(doc, s.label), p[1] - rim - 11]
        : level ? [p[0] - widthOf(doc, s.label) / 2, p[1] - 12] : [p[0] + (rim ? rim + 3 : 5), p[1] - 4];
      write(doc, s.label, { lineBreak: false }, place);
    }
  }
  doc.fillColor(MUTED).fontSize(8);
  write(doc, sketch.title, { width: w - 12 }, [x + 6, y + 6]);
}

function heading(doc: PDFKit.PDFDocument, text: string): void {
  if (doc.y > doc.page.height - 120) doc.addPage();
  doc.moveDown(0.6).fillColor(ACCENT).fontSize(11);
  write(doc, text, { weight: 'bold' });
  doc.fillColor(INK).fontSize(9.5).moveDown(0.2);
}

function rows(doc: PDFKit.PDFDocument, pairs: ReadonlyArray<readonly [string, string]>): void {
  const left = doc.page.margins.left;
  const width = doc.page.width - left - doc.page.margins.right;
  for (const [k, v] of pairs) {
    if (doc.y > doc.page.height - 80) doc.addPage();
    const y = doc.y;
    doc.fillColor(MUTED);
    write(doc, k, { width: width * 0.38 }, [left, y]);
    const after = doc.y;
    doc.fillColor(INK);
    write(doc, v, { width: width * 0.6 }, [left + width * 0.4, y]);
    doc.y = Math.max(after, doc.y);
    doc.x = left;
  }
}

/**
 * The printable set-up sheet: heading, sketch, inputs, results and gauge stack from the shared
 * engine, check values, derivation, notes, attached drawings, cautions and a link back. Streams are
 * left uncompressed (the sheets are small), so the text stays searchable.
 */
export async function renderSetupSheet({ setup, attachments, storage, link, boxes }: SheetSource): Promise<Buffer> {
  const inputs = setup.inputs;
  const results = setupResults(setup.kind, inputs, boxes);
  const metric = inputs['unit'] === 'mm';
  const doc = new PDFDocument({
    size: metric ? 'A4' : 'LETTER',
    margin: 48,
    compress: false,
    // Kept until the end, so each page after the first can be headed with the set-up and page count.
    bufferPages: true,
    info: { Title: `Set-up sheet: ${setup.name}`, Author: 'Slantwise', Subject: `${kindLabel(setup.kind)} set-up, version ${setup.version}` },
  });
  registerSheetFonts(doc);
  doc.font(baseFont('regular'));
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  const left = doc.page.margins.left;
  const width = doc.page.width - left - doc.page.margins.right;
  doc.fillColor(MUTED).fontSize(9);
  write(doc, 'SLANTWISE SET-UP SHEET');
  doc.fillColor(INK).fontSize(18);
  write(doc, setup.name, { weight: 'bold' });
  const released = setup.releasedAt ? `released ${setup.releasedAt.toISOString().slice(0, 10)}${setup.releasedBy ? ` by ${setup.releasedBy.name}` : ''}` : 'not released';
  doc.fontSize(9.5).fillColor(MUTED);
  write(doc, `${kindLabel(setup.kind)} · status ${setup.status.toUpperCase()} (${released}) · version ${setup.version} · job ${setup.job ?? '-'} · owner ${setup.owner?.name ?? '-'}`);
  if (setup.status !== 'released') {
    doc.moveDown(0.3).fillColor('#b3261e');
    write(doc, setup.status === 'draft' && setup.releasedVersion
      ? `NOT RELEASED: a revision of version ${setup.releasedVersion}, which was released; check with a lead before running it.`
      : 'NOT RELEASED: check with a lead before running this set-up.', { weight: 'bold' });
  }

  const sketch = sketchFor(setup.kind, inputs, results);
  if (sketch) {
    doc.moveDown(0.6);
    const top = doc.y;
    drawSketch(doc, sketch, left, top, width, 190);
    doc.x = left;
    doc.y = top + 198;
  }

  heading(doc, 'Inputs');
  rows(doc, inputRows(setup.kind, inputs, results).map((row) => [row.label, row.value] as const));

  heading(doc, 'Results');
  if (results.ok) {
    rows(doc, results.lines.map((l) => [l.label, l.value] as const));
    if (results.warnings.length) {
      doc.moveDown(0.3).fillColor('#8a4b00');
      for (const w of results.warnings) write(doc, `Warning: ${w}`);
      doc.fillColor(INK);
    }
  } else {
    doc.fillColor('#b3261e');
    write(doc, results.error);
    doc.fillColor(INK);
  }

  if (results.ok && results.passes) {
    heading(doc, 'Passes and DRO readings');
    const unit = String(results.value['unit'] ?? '');
    rows(doc, [['Pass', `Cut (${unit})   ·   DRO after the pass (${unit})`] as const, ...results.passes.map((p) => [`Pass ${p.pass}`, `${p.cut}   ·   ${p.reading}`] as const)]);
  }

  if (results.ok && results.holding) {
    const holding = results.holding;
    heading(doc, holding.ok ? holding.plan.heading : 'Work-holding');
    if (holding.ok) {
      holding.plan.instructions.forEach((line, i) => write(doc, `${i + 1}. ${line}`, { paragraphGap: 2 }));
      if (holding.plan.warnings.length) {
        doc.moveDown(0.3).fillColor('#8a4b00');
        for (const w of holding.plan.warnings) write(doc, `Warning: ${w}`);
        doc.fillColor(INK);
      }
    } else {
      doc.fillColor('#b3261e');
      write(doc, `No holding plan: ${holding.error}`);
      doc.fillColor(INK);
    }
  }

  if (results.ok && results.stack?.length) {
    heading(doc, 'Gauge-block stack (wringing order)');
    write(doc, `${results.stack.join(' + ')}  (${results.stack.length} ${results.stack.length === 1 ? 'block' : 'blocks'})`);
  }
  if (results.ok && results.box) {
    doc.moveDown(0.2).fillColor(MUTED);
    write(doc, `Blocks from our box "${results.box.name}", as the team's inventory stood when this sheet was printed (${new Date().toISOString().slice(0, 10)}); blocks marked missing or damaged are left out.`);
    doc.fillColor(INK);
  }

  if (setup.checks.length) {
    heading(doc, 'Check values for each part');
    rows(doc, setup.checks.map((c) => [c.label, `${c.nominal} ${c.unit}  +${c.plus} / -${c.minus}`] as const));
  }

  if (results.ok && results.steps.length) {
    heading(doc, 'Derivation');
    for (const s of results.steps) {
      if (doc.y > doc.page.height - 80) doc.addPage();
      doc.fillColor(INK);
      write(doc, s.label, { weight: 'bold', continued: true });
      doc.fillColor(MUTED);
      write(doc, `   ${s.formula};  ${s.substituted} = ${s.value} ${s.unit}`);
    }
    doc.fillColor(INK);
  }

  if (setup.notes.trim()) {
    heading(doc, 'Notes');
    write(doc, setup.notes);
  }

  const images = attachments.filter((a) => a.contentType !== 'application/pdf');
  if (attachments.length) {
    heading(doc, 'Attached drawings and photos');
    for (const a of attachments) write(doc, `${a.fileName} (${a.contentType}, ${a.size} bytes, sha256 ${a.sha256.slice(0, 16)}…)`);
    for (const a of images.slice(0, 2)) {
      const key = a.size <= 5 * 1024 * 1024 ? a.storageKey : a.thumbnailKey;
      if (!key) continue;
      const bytes = await storage.get(key).catch(() => null);
      if (!bytes) continue;
      if (doc.y > doc.page.height - 260) doc.addPage();
      doc.moveDown(0.4).image(bytes, { fit: [width, 200] });
      doc.moveDown(0.4);
    }
  }

  heading(doc, 'Cautions');
  const cautions = sheetCautions(setup.kind, results.ok ? results.cautions : []);
  for (const c of cautions) write(doc, `• ${c}`, { paragraphGap: 2 });

  doc.moveDown(0.8).fillColor(MUTED).fontSize(8.5);
  write(doc, 'Open this set-up in Slantwise: ', { continued: true });
  doc.fillColor(ACCENT);
  write(doc, link, { link, underline: true });
  doc.fillColor(MUTED);
  write(doc, `Printed ${new Date().toISOString().slice(0, 16).replace('T', ' ')} UTC`);
  // A sheet that runs on: each further page says whose it is.
  const pages = doc.bufferedPageRange();
  for (let i = 1; i < pages.count; i += 1) {
    doc.switchToPage(pages.start + i);
    doc.fillColor(MUTED).fontSize(8.5);
    write(doc, `${setup.name} · version ${setup.version} · page ${i + 1} of ${pages.count}`, { width, lineBreak: false }, [left, doc.page.margins.top - 24]);
  }
  doc.end();
  return done;
}
