import { describe, expect, it } from 'vitest';
import { toCsv } from '../../../src/lib/csv';

describe('toCsv (RFC 4180)', () => {
  it('quotes fields with commas, quotes or line breaks and ends lines with CRLF', () => {
    expect(toCsv([['a', 'b,c'], ['say "hi"', 'two\nlines'], [1.5, null]])).toBe('a,"b,c"\r\n"say ""hi""","two\nlines"\r\n1.5,\r\n');
  });

  it('keeps text that a spreadsheet would run as a formula as text (OWASP CSV injection)', () => {
    expect(toCsv([['=1+2', '@SUM(A1)', '-3', 'plain']])).toBe("'=1+2,'@SUM(A1),'-3,plain\r\n");
    expect(toCsv([[-3]])).toBe('-3\r\n');
  });
});
