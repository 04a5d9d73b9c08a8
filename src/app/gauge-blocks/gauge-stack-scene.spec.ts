import { type GaugeStackSceneInput, gaugeStackScene } from './gauge-stack-scene';

/**
 * 600 wide: height min(520, max(300, 0.7·600)) = 420, base line at 420 − 36 = 384, free height
 * 420 − 48 − 36 = 336 for a 2.0000 stack → 168 view units per inch. Columns 108 wide centred at
 * 0.33·600 = 198 (x 144…252) and 0.72·600 = 432 (x 378…486). Derived by hand.
 */
const INPUT: GaugeStackSceneInput = {
  target: 2,
  fewest: [{ size: 1.5, label: '1.500' }, { size: 0.5, label: '0.500' }],
  lastDigit: [{ size: 1, label: '1.000' }, { size: 0.5, label: '0.500' }, { size: 0.5, label: '0.500' }],
  totalLabel: '2.0000 in',
};

describe('gaugeStackScene', () => {
  const scene = gaugeStackScene(INPUT, 600);

  it('should size the view to the width', () => expect(scene.viewBox).toBe('0 0 600 420'));

  it('should stand the fewest stack block by block from the base, to scale', () => {
    expect(scene.stacks[0].pieces.map((p) => p.d)).toEqual(['M144,384L252,384L252,132L144,132Z', 'M144,132L252,132L252,48L144,48Z']);
    expect(scene.stacks[0].title).toBe('Fewest: 2 blocks');
  });

  it('should stand the last-digit stack beside it to the same height', () => {
    const pieces = scene.stacks[1].pieces;
    expect(pieces[0].d).toBe('M378,384L486,384L486,216L378,216Z');
    expect(pieces[2].d).toBe('M378,132L486,132L486,48L378,48Z');
    expect(scene.stacks[1].title).toBe('Last-digit method: 3 blocks');
  });

  it('should label each block beside its column at its middle when there is room', () => {
    expect(scene.stacks[0].pieces.map((p) => [p.labelX, p.labelY])).toEqual([[114, 258], [114, 90]]);
    expect(scene.stacks[1].pieces.map((p) => [p.labelX, p.labelY])).toEqual([[516, 300], [516, 174], [516, 90]]);
  });

  it('should dimension the stack length between the columns', () => {
    // Gap 378 − 252 = 126, dimension line at 252 + 63.
    expect(scene.totalDim.line).toBe('M315,48L315,384');
    expect(scene.totalDim.label.text).toBe('2.0000 in');
  });

  it('should keep both headings apart and the right-hand labels inside on a phone', () => {
    const phone = gaugeStackScene(
      { target: 1.2519, fewest: [{ size: 1, label: '1.000' }, { size: 0.101, label: '0.101' }, { size: 0.1009, label: '0.1009' }, { size: 0.05, label: '0.050' }], lastDigit: [{ size: 1, label: '1.000' }, { size: 0.101, label: '0.101' }, { size: 0.1009, label: '0.1009' }, { size: 0.05, label: '0.050' }], totalLabel: '1.2519 in' },
      368,
    );
    expect(phone.stacks.map((s) => s.title)).toEqual(['Fewest: 4 blocks', 'Last digit: 4 blocks']);
    expect(phone.narrow).toBe(true);
    // At ~6.8 px a character (12 px semibold headings) the headings' halves do not meet; at ~7.5 px
    // (13 px labels) "0.1009" ends inside the 368 wide drawing.
    const [a, b] = phone.stacks;
    expect(a!.titleX + ('Fewest: 4 blocks'.length * 6.8) / 2).toBeLessThan(b!.titleX - ('Last digit: 4 blocks'.length * 6.8) / 2);
    expect(Math.max(...b!.pieces.map((p) => p.labelX)) + 6 * 7.5).toBeLessThan(368);
  });

  it('should draw one centred column when the last-digit method gets stuck', () => {
    const one = gaugeStackScene({ ...INPUT, lastDigit: null }, 600);
    expect(one.stacks.length).toBe(1);
    expect(one.stacks[0].pieces[0].d).toBe('M246,384L354,384L354,132L246,132Z');
  });
});
