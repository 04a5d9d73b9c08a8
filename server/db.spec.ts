import { splitPlaceholders } from './db';

describe('splitPlaceholders', () => {
  it('should split at each ? placeholder', () => {
    expect(splitPlaceholders('SELECT a FROM t WHERE b = ? AND c IN (?, ?)')).toEqual(['SELECT a FROM t WHERE b = ', ' AND c IN (', ', ', ')']);
  });

  it('should give one piece for a statement without placeholders', () => {
    expect(splitPlaceholders('SELECT 1')).toEqual(['SELECT 1']);
  });

  it('should leave a ? inside quoted text, a quoted name or an escaped quote alone', () => {
    expect(splitPlaceholders("SELECT 'why?', \"and?\", `odd?name` FROM t WHERE a = ?")).toEqual(["SELECT 'why?', \"and?\", `odd?name` FROM t WHERE a = ", '']);
    expect(splitPlaceholders("SELECT 'it\\'s ?' WHERE a = ? AND b = 'x'")).toEqual(["SELECT 'it\\'s ?' WHERE a = ", " AND b = 'x'"]);
  });

  it('should answer the same pieces for the same text (kept, not split again)', () => {
    const sql = 'SELECT ? AS kept';
    expect(splitPlaceholders(sql)).toBe(splitPlaceholders(sql));
  });
});
