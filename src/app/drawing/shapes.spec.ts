import { chordAtLevel, clipToLevel, hatchPath, hatchSegments, polygonPath, polylinePath, segmentsPath, spreadPositions } from './shapes';

// Expected values worked by hand (derived).
describe('shapes', () => {
  it('polygonPath should close the outline', () => expect(polygonPath([{ x: 0, y: 0 }, { x: 10, y: 0 }, { x: 10, y: 5 }])).toBe('M0,0L10,0L10,5Z'));
  it('polygonPath should give nothing for one point', () => expect(polygonPath([{ x: 1, y: 1 }])).toBe(''));
  it('polylinePath should leave the line open', () => expect(polylinePath([{ x: 0, y: 0 }, { x: 1.234, y: 5 }])).toBe('M0,0L1.23,5'));
  it('segmentsPath should move between segments', () => {
    expect(segmentsPath([[{ x: 0, y: 0 }, { x: 1, y: 0 }], [{ x: 0, y: 2 }, { x: 1, y: 2 }]])).toBe('M0,0L1,0M0,2L1,2');
  });

  describe('hatchSegments', () => {
    const square = [{ x: 0, y: 0 }, { x: 10, y: 0 }, { x: 10, y: 10 }, { x: 0, y: 10 }];

    it('should cut level hatching across a square, half a spacing off the grid', () => {
      expect(hatchSegments(square, 5, 0)).toEqual([
        [{ x: 0, y: 2.5 }, { x: 10, y: 2.5 }],
        [{ x: 0, y: 7.5 }, { x: 10, y: 7.5 }],
      ]);
    });

    it('should cut upright hatching across a square', () => {
      expect(hatchSegments(square, 3, 90)).toEqual([
        [{ x: 1.5, y: 10 }, { x: 1.5, y: 0 }],
        [{ x: 4.5, y: 10 }, { x: 4.5, y: 0 }],
        [{ x: 7.5, y: 10 }, { x: 7.5, y: 0 }],
      ]);
    });

    it('should clip level hatching to a triangle', () => {
      expect(hatchSegments([{ x: 0, y: 0 }, { x: 10, y: 0 }, { x: 0, y: 10 }], 4, 0)).toEqual([
        [{ x: 0, y: 2 }, { x: 8, y: 2 }],
        [{ x: 0, y: 6 }, { x: 4, y: 6 }],
      ]);
    });

    it('should run 45° hatching up and to the right, through the centre for spacing 10√2', () => {
      // Local offset of the centre (5, 5) across 45° lines: (5 + 5)·sin 45° = half of 10√2.
      expect(hatchSegments(square, 10 * Math.SQRT2, 45)).toEqual([[{ x: 0, y: 10 }, { x: 10, y: 0 }]]);
    });

    it('should give nothing for a degenerate polygon or spacing', () => {
      expect(hatchSegments([{ x: 0, y: 0 }, { x: 1, y: 1 }], 1)).toEqual([]);
      expect(hatchSegments(square, 0)).toEqual([]);
    });

    it('hatchPath should join the segments into one path', () => {
      expect(hatchPath(square, 5, 0)).toBe('M0,2.5L10,2.5M0,7.5L10,7.5');
    });
  });
});

describe('level cuts', () => {
  // Triangle with a level top edge from (0,4) to (4,4) and its lowest corner at (4,0).
  const tri = [{ x: 0, y: 4 }, { x: 4, y: 4 }, { x: 4, y: 0 }];

  describe('clipToLevel', () => {
    it('should keep the part above a level', () => {
      expect(clipToLevel(tri, 2, 'above')).toEqual([{ x: 0, y: 4 }, { x: 4, y: 4 }, { x: 4, y: 2 }, { x: 2, y: 2 }]);
    });
    it('should keep the part below a level', () => {
      expect(clipToLevel(tri, 2, 'below')).toEqual([{ x: 4, y: 2 }, { x: 4, y: 0 }, { x: 2, y: 2 }]);
    });
    it('should give nothing when the polygon lies wholly on the other side', () => {
      expect(clipToLevel(tri, 5, 'above')).toEqual([]);
    });
  });

  describe('chordAtLevel', () => {
    it('should cross the triangle at mid height', () => expect(chordAtLevel(tri, 2)).toEqual([{ x: 2, y: 2 }, { x: 4, y: 2 }]));
    it('should give the whole edge lying on the level', () => expect(chordAtLevel(tri, 4)).toEqual([{ x: 0, y: 4 }, { x: 4, y: 4 }]));
    it('should give null at a single vertex or off the polygon', () => {
      expect(chordAtLevel(tri, 0)).toBeNull();
      expect(chordAtLevel(tri, 9)).toBeNull();
    });
  });
});

describe('spreadPositions', () => {
  it('should leave well-spaced positions alone', () => expect(spreadPositions([0, 20, 40], 10)).toEqual([0, 20, 40]));
  it('should push crowded positions apart in order', () => expect(spreadPositions([0, 2, 4, 30], 10)).toEqual([0, 10, 20, 30]));
  it('should slide a run back inside the limit', () => expect(spreadPositions([0, 95, 96], 10, 100)).toEqual([0, 90, 100]));
  it('should give nothing for nothing', () => expect(spreadPositions([], 10)).toEqual([]));
});
