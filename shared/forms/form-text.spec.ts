import { savedForm, sizeList } from './form-text';

describe('sizeList', () => {
  it('splits sizes typed with commas, semicolons, spaces and new lines, keeping each as typed', () => {
    expect(sizeList('0.1001, 0.125 0.5;\n1.000')).toEqual(['0.1001', '0.125', '0.5', '1.000']);
  });

  it('gives none for empty or blank text', () => {
    expect(sizeList('')).toBeUndefined();
    expect(sizeList(' , ;\t')).toBeUndefined();
  });
});

describe('savedForm', () => {
  it('reads the saved text of each field and empty text for fields missing or not text', () => {
    const form = savedForm<{ unit: string; angle: string; missing: string; count: string }>({ unit: 'in', angle: '14.5', count: 3 });
    expect(form.unit).toBe('in');
    expect(form.angle).toBe('14.5');
    expect(form.missing).toBe('');
    expect(form.count).toBe('');
  });
});
