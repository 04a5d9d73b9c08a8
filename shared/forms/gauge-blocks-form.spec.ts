import { celsiusOf } from './gauge-blocks-form';

describe('celsiusOf', () => {
  it('should read a temperature ending with F as °F and give it in °C', () => {
    // °C = (°F − 32) · 5/9: 68 °F = 20 °C, 77 °F = 25 °C, 32 °F = 0 °C, 70 °F = 21.11 °C (definition of the scale).
    expect(celsiusOf('68F')).toBe('20');
    expect(celsiusOf('77 °F')).toBe('25');
    expect(celsiusOf('32f')).toBe('0');
    expect(celsiusOf('70F')).toBe('21.11');
  });

  it('should keep °C as typed, without a trailing C', () => {
    expect(celsiusOf('23.5')).toBe('23.5');
    expect(celsiusOf('23.5 °C')).toBe('23.5');
    expect(celsiusOf('')).toBe('');
    expect(celsiusOf('warm')).toBe('warm');
  });
});
