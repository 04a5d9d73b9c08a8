import { historyFieldLabel } from './history-field';

describe('historyFieldLabel', () => {
  it('should name the set-up\'s own fields and its files in words', () => {
    expect(historyFieldLabel('attachments')).toBe('Files');
    expect(historyFieldLabel('status')).toBe('Status');
    expect(historyFieldLabel('checks')).toBe('Checks');
  });

  it('should name an input as the set-up\'s list of inputs does', () => {
    expect(historyFieldLabel('inputs.taperLength')).toBe('Taper length');
    expect(historyFieldLabel('inputs.cutterDiameter')).toBe('Cutter diameter');
    expect(historyFieldLabel('inputs.rollDiameter1')).toBe('Roll diameter 1');
    expect(historyFieldLabel('inputs.angle')).toBe('Angle');
  });
});
