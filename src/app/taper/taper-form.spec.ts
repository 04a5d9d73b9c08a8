import { calculateTaper } from '../../../shared/calc/taper';
import { CHAMFER_GIVEN_OPTIONS, TAPER_DEFAULTS, givenFields, taperResultItems, taperSceneInput, toTaperRequest } from './taper-form';

describe('taper form', () => {
  describe('givenFields', () => {
    it('should name the two sizes of each choice', () => {
      expect(givenFields('angle-length')).toEqual({ angle: true, taperLength: true, end: false, faceLength: false });
      expect(givenFields('end-face')).toEqual({ angle: false, taperLength: false, end: true, faceLength: true });
    });
  });

  describe('toTaperRequest', () => {
    it('should send only the two given sizes', () => {
      const request = toTaperRequest({ ...TAPER_DEFAULTS, endThickness: '0.4', faceLength: '2' });
      expect(request).toMatchObject({ unit: 'in', shape: 'taper', thickness: '0.75', angle: "7°30'", taperLength: '2.5' });
      expect(request.endThickness).toBeUndefined();
      expect(request.faceLength).toBeUndefined();
    });

    it('should send the end size as removedAtEnd for a chamfer', () => {
      const request = toTaperRequest({ ...TAPER_DEFAULTS, shape: 'chamfer', given: 'length-end', endThickness: '0.1' });
      expect(request).toMatchObject({ shape: 'chamfer', taperLength: '2.5', removedAtEnd: '0.1' });
      expect(request.endThickness).toBeUndefined();
      expect(request.angle).toBeUndefined();
    });
  });

  it('should name a chamfer\'s figures by its legs, in the results and in what defines it', () => {
    const chamfer = calculateTaper(toTaperRequest({ ...TAPER_DEFAULTS, shape: 'chamfer', given: 'length-end', taperLength: '0.1', endThickness: '0.1' }));
    if (!chamfer.ok) throw new Error(chamfer.error);
    const labels = taperResultItems(chamfer.value).map((i) => i.label);
    expect(labels).toEqual(expect.arrayContaining(['Leg on the top face', 'Leg on the end face']));
    expect(labels).not.toContain('Taper length');
    // Equal legs of 0.1 make a 45° chamfer (tan α = 0.1 / 0.1, derived).
    expect(chamfer.value.angleDeg).toBe('45.0000');
    expect(CHAMFER_GIVEN_OPTIONS.find((o) => o.value === 'length-end')?.label).toBe('Top-face leg and end-face leg');
  });

  describe('with the demo defaults', () => {
    // Fixture wedge, 7°30' over 2.5 in of 0.75 in stock. Derived from REFERENCE.md §1 geometry with
    // four-figure trig: tan 7.5° = 0.13165, sin 7.5° = 0.13053, cos 7.5° = 0.99144.
    const result = calculateTaper(toTaperRequest(TAPER_DEFAULTS));
    if (!result.ok) throw new Error(result.error);
    const r = result.value;

    it('should list the stop readings first, at 0.0001 in', () => {
      const items = taperResultItems(r);
      expect(items[0]).toMatchObject({ label: 'Depth to stop', value: '0.3263', unit: 'in', emphasis: true }); // 2.5 · 0.13053
      expect(items[1]).toMatchObject({ label: 'End thickness', value: '0.4209', emphasis: true }); // 0.75 − 2.5 · 0.13165
      expect(items.find((i) => i.label === 'Face length')?.value).toBe('2.5216'); // 2.5 / 0.99144
      expect(items.find((i) => i.label === 'Passes')?.value).toBe('4'); // ⌈0.3263 / 0.1⌉
    });

    it('should give the drawing the sizes, the readings and the labels', () => {
      const scene = taperSceneInput(r, TAPER_DEFAULTS, 2);
      expect(scene).toMatchObject({ thickness: 0.75, taperLength: 2.5, partLength: 4, cutterDiameter: 0.75, selectedPass: 2 });
      expect(scene.readings).toEqual([0.1, 0.2, 0.3, 0.3263]);
      expect(scene.labels.depthToStop).toBe('0.3263 in');
    });
  });
});
