import { remapBoxRefs, remapInputsText, remapRevisionText } from './box-refs';

describe('box names in set-up inputs on import', () => {
  const ids = new Map([[7, 41], [8, 42]]);

  it('should rewrite every box name to the box\'s new id, anywhere in the inputs', () => {
    expect(remapBoxRefs({ set: 'box:7', holding: 'angle-blocks', angleSet: 'box:8', list: ['box:7', 'inch-81'], n: 3 }, ids)).toEqual({
      set: 'box:41',
      holding: 'angle-blocks',
      angleSet: 'box:42',
      list: ['box:41', 'inch-81'],
      n: 3,
    });
  });

  it('should leave other text alone, even text that only looks like a box name', () => {
    expect(remapBoxRefs({ set: 'inch-81', note: 'box:7 on the left', odd: 'box:07', zero: 'box:0' }, ids)).toEqual({ set: 'inch-81', note: 'box:7 on the left', odd: 'box:07', zero: 'box:0' });
  });

  it('should make a box that is not in the archive "no set", never another box\'s number', () => {
    expect(remapInputsText(JSON.stringify({ set: 'box:9', angle: '12' }), ids)).toBe(JSON.stringify({ set: '', angle: '12' }));
  });

  it('should rewrite a revision\'s snapshot inputs and the from/to of its input changes only', () => {
    const snapshot = JSON.stringify({ name: 'box:7', inputs: { set: 'box:7' } });
    expect(JSON.parse(remapRevisionText('snapshot', snapshot, ids) as string)).toEqual({ name: 'box:7', inputs: { set: 'box:41' } });
    const changes = JSON.stringify([{ field: 'inputs.set', from: 'inch-81', to: 'box:8' }, { field: 'name', from: 'box:7', to: 'x' }]);
    expect(JSON.parse(remapRevisionText('changes', changes, ids) as string)).toEqual([{ field: 'inputs.set', from: 'inch-81', to: 'box:42' }, { field: 'name', from: 'box:7', to: 'x' }]);
  });

  it('should leave text that is not JSON, and null, as they are', () => {
    expect(remapInputsText('{not json', ids)).toBe('{not json');
    expect(remapRevisionText('changes', null, ids)).toBeNull();
  });
});
