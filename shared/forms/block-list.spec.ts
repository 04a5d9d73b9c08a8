import { angleLabel, arcSecondsOf, blockLabel, blockSizeError, readBlockList } from './block-list';

describe('readBlockList: gauge blocks', () => {
  it('reads one size per line, a count after x or ×, and sorts smallest first', () => {
    const read = readBlockList('gauge-blocks', 'in', '1.000\n0.1001 x 2\n.050 × 2\n\n0.125*1');
    expect(read).toEqual({
      ok: true,
      blocks: [
        { size: '0.05', count: 2 },
        { size: '0.1001', count: 2 },
        { size: '0.125', count: 1 },
        { size: '1', count: 1 },
      ],
      total: 6,
    });
  });

  it('expands a series and counts a size listed twice twice', () => {
    // The 0.101–0.149 in series of the common 81-piece inch set has 49 sizes (common practice).
    const read = readBlockList('gauge-blocks', 'in', '0.101 to 0.149 by 0.001; 0.125');
    expect(read.ok).toBe(true);
    if (!read.ok) return;
    expect(read.blocks).toHaveLength(49);
    expect(read.blocks[0]).toEqual({ size: '0.101', count: 1 });
    expect(read.blocks[48]).toEqual({ size: '0.149', count: 1 });
    expect(read.blocks.find((b) => b.size === '0.125')).toEqual({ size: '0.125', count: 2 });
    expect(read.total).toBe(50);
  });

  it('gives a series in mm with a count for each size', () => {
    const read = readBlockList('gauge-blocks', 'mm', '1.01 to 1.09 by 0.01 x 2');
    expect(read.ok && read.blocks.map((b) => `${b.size}×${b.count}`)).toEqual(['1.01×2', '1.02×2', '1.03×2', '1.04×2', '1.05×2', '1.06×2', '1.07×2', '1.08×2', '1.09×2']);
  });

  it('names the line that is wrong and why', () => {
    expect(readBlockList('gauge-blocks', 'in', '0.1001\n0.1o02')).toEqual({ ok: false, error: expect.stringContaining('Line 2 ("0.1o02"): not a size') });
    expect(readBlockList('gauge-blocks', 'in', '1,5')).toEqual({ ok: false, error: expect.stringContaining('a point for decimals') });
    expect(readBlockList('gauge-blocks', 'in', '0.1 x 0')).toEqual({ ok: false, error: expect.stringContaining('the count must be 1 to 50') });
    expect(readBlockList('gauge-blocks', 'in', '-0.1')).toEqual({ ok: false, error: expect.stringContaining('not a positive size') });
    expect(readBlockList('gauge-blocks', 'in', '0')).toEqual({ ok: false, error: expect.stringContaining('not a positive size') });
    expect(readBlockList('gauge-blocks', 'in', '0.10001234')).toEqual({ ok: false, error: expect.stringContaining('at most 6 decimals') });
    expect(readBlockList('gauge-blocks', 'in', '0.101 to 0.149 by 0.005')).toEqual({ ok: false, error: expect.stringContaining('0.005 steps from 0.101 do not land on 0.149') });
    expect(readBlockList('gauge-blocks', 'in', '0.2 to 0.1 by 0.01')).toEqual({ ok: false, error: expect.stringContaining('from a smaller size to a larger one') });
    expect(readBlockList('gauge-blocks', 'mm', '1 to 1000 by 1')).toEqual({ ok: false, error: expect.stringContaining('more than 200 sizes') });
    expect(readBlockList('gauge-blocks', 'in', '0.1 x 30\n0.1 x 30')).toEqual({ ok: false, error: expect.stringContaining('more than 50 blocks of 0.100 in') });
    expect(readBlockList('gauge-blocks', 'in', ' \n ; ')).toEqual({ ok: false, error: expect.stringContaining('List the blocks in the box') });
  });

  it('refuses a gauge block longer than the standards cover', () => {
    // ISO 3650 covers gauge blocks up to 1000 mm nominal length.
    expect(readBlockList('gauge-blocks', 'mm', '1000').ok).toBe(true);
    expect(readBlockList('gauge-blocks', 'mm', '1001')).toEqual({ ok: false, error: expect.stringContaining('longer than any gauge block (at most 1000 mm)') });
    expect(readBlockList('gauge-blocks', 'in', '41')).toEqual({ ok: false, error: expect.stringContaining('at most 40 in') });
  });
});

describe('readBlockList: angle blocks', () => {
  it('reads angles in degrees, minutes and seconds as whole seconds of arc', () => {
    // 1° = 3600″, 27′ = 1620″ (definition of the degree and minute of arc).
    const read = readBlockList('angle-blocks', 'arcsec', `1°\n27'\n3" x 2\n45`);
    expect(read).toEqual({ ok: true, blocks: [{ size: '3', count: 2 }, { size: '1620', count: 1 }, { size: '3600', count: 1 }, { size: '162000', count: 1 }], total: 5 });
  });

  it('refuses a fraction of a second, a right angle and text', () => {
    expect(readBlockList('angle-blocks', 'arcsec', '0.5"')).toEqual({ ok: false, error: expect.stringContaining('whole seconds') });
    expect(readBlockList('angle-blocks', 'arcsec', '90°')).toEqual({ ok: false, error: expect.stringContaining('90° is not an angle block') });
    // 360° = 1,296,000″: said in degrees, not as a number of seconds.
    expect(readBlockList('angle-blocks', 'arcsec', '360°')).toEqual({ ok: false, error: expect.stringContaining('360° is not an angle block') });
    expect(readBlockList('angle-blocks', 'arcsec', 'one degree')).toEqual({ ok: false, error: expect.stringContaining("e.g. 1°, 27' or 3\" x 2") });
  });
});

describe('block sizes', () => {
  it('checks what the server stores', () => {
    expect(blockSizeError('angle-blocks', 'arcsec', '3600')).toBeNull();
    expect(blockSizeError('angle-blocks', 'arcsec', '1.5')).toContain('whole seconds');
    expect(blockSizeError('gauge-blocks', 'in', '20')).toBeNull();
    expect(blockSizeError('gauge-blocks', 'in', 'abc')).toContain('not a positive size');
  });

  it('marks blocks as they are engraved', () => {
    expect(angleLabel(5400)).toBe('1°30′');
    expect(angleLabel(3)).toBe('3″');
    expect(arcSecondsOf(`0°27'`)).toBe(1620);
    expect(arcSecondsOf('0.5"')).toBeNull();
    expect(blockLabel('in', '0.1')).toBe('0.100 in');
    expect(blockLabel('mm', '1.005')).toBe('1.005 mm');
    expect(blockLabel('arcsec', '1620')).toBe('27′');
  });
});
