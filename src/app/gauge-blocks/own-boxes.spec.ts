import { HttpErrorResponse } from '@angular/common/http';

import type { InventorySetDto } from '../../../shared/api/inventory';
import { boxFailureMessage, boxIdOf, boxValue, excludedNote, toOwnBox } from './own-boxes';

const SET: InventorySetDto = {
  id: 7, type: 'gauge-blocks', name: 'Inch 81-piece set, cabinet 2', unit: 'in', standardSet: 'inch-81', grade: '0',
  wearBlockSize: '0.050', wearBlockCount: 2, notes: '', version: 3,
  totals: { sizes: 81, blocks: 81, missing: 1, damaged: 1, available: 79 }, createdAt: '', updatedAt: '',
};

describe('own gauge-block boxes', () => {
  it('should tell a team box from a standard set by its picker value', () => {
    expect(boxValue(7)).toBe('box:7');
    expect(boxIdOf('box:7')).toBe(7);
    expect([boxIdOf('inch-81'), boxIdOf(''), boxIdOf('box:0'), boxIdOf('box:7x'), boxIdOf('box:-1')]).toEqual([null, null, null, null, null]);
  });

  it('should list a set as "Our box" with what is usable', () => {
    expect(toOwnBox(SET)).toEqual(expect.objectContaining({ value: 'box:7', label: 'Our box: Inch 81-piece set, cabinet 2', wearBlockSize: '0.050', notes: '79 of 81 blocks usable (1 missing, 1 damaged)' }));
    expect(toOwnBox({ ...SET, wearBlockCount: 1 })?.wearBlockSize).toBeNull();
    expect(toOwnBox({ ...SET, unit: 'arcsec' })).toBeNull();
  });

  it('should name the blocks left out with why', () => {
    expect(excludedNote([{ size: '0.1007', missing: 1, damaged: 0 }, { size: '0.137', missing: 0, damaged: 1 }], 'in')).toBe('0.1007 in (1 missing); 0.137 in (1 damaged)');
    expect(excludedNote([], 'in')).toBe('');
  });

  it('should turn a refused stack into a sentence naming the field', () => {
    const refused = new HttpErrorResponse({ status: 422, error: { error: 'Gauge stack: target is finer than the box can make', fields: { target: 'is finer than the box can make' } } });
    expect(boxFailureMessage(refused)).toBe('Stack length is finer than the box can make.');
    expect(boxFailureMessage(new HttpErrorResponse({ status: 404, error: { error: 'No block set with that id in your team.' } }))).toBe('No block set with that id in your team.');
  });
});
