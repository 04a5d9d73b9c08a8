import { nearestOnBox, overlapArea, placeLabel, textBox } from './label-placement';

describe('label placement', () => {
  const view = { x: 0, y: 0, width: 400, height: 200 };

  it('should size a label from its length and anchor', () => {
    expect(textBox({ x: 100, y: 50, anchor: 'start' }, 'α 60°')).toEqual({ x: 100, y: 42, width: 41, height: 16 });
    expect(textBox({ x: 100, y: 50, anchor: 'end' }, 'α 60°').x).toBe(59);
    expect(textBox({ x: 100, y: 50, anchor: 'middle' }, 'α 60°').x).toBe(79.5);
  });

  it('should take the first spot that is clear', () => {
    const blocked = { x: 90, y: 40, width: 60, height: 20 };
    const spot = placeLabel('α 60°', [{ x: 100, y: 50, anchor: 'start' }, { x: 100, y: 90, anchor: 'start' }], [blocked], view);
    expect([spot.x, spot.y]).toEqual([100, 90]);
    expect(overlapArea(spot.box, blocked)).toBe(0);
  });

  it('should not leave the view, and fall back to the least overlap', () => {
    const spot = placeLabel('α 60°', [{ x: 390, y: 50, anchor: 'start' }, { x: 200, y: 50, anchor: 'middle' }], [{ x: 195, y: 45, width: 4, height: 4 }], view);
    expect(spot.x).toBe(200);
  });

  it('should end a leader on the box edge nearest the point', () => {
    expect(nearestOnBox({ x: 10, y: 10, width: 20, height: 10 }, { x: 0, y: 15 })).toEqual({ x: 10, y: 15 });
  });
});
