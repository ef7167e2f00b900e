// VIN: 49 CFR 565.15 check digit (Tables III–V; the worked example of Table V is 1G4AH59H?5G118341
// → 4), ISO 3779 structure. Cases from TRADE-REFERENCES §8.1 ([FOUND] tables, [DERIVED] sums).
import { describe, expect, it } from 'vitest';
import { checkVin, normaliseRegistration, vinCheckDigit } from '../../../src/lib/trade';

describe('checkVin', () => {
  it('the regulation\'s worked example: 1G4AH59H45G118341, Σ 411, 411 mod 11 = 4 (49 CFR 565.15 Table V)', () => {
    const check = checkVin('1G4AH59H45G118341');
    expect(check.valid).toBe(true);
    expect(check.checkDigit).toEqual({ expected: '4', found: '4', matches: true, required: true });
    expect(vinCheckDigit('1G4AH59H?5G118341'.replace('?', '0'))).toBe('4');
  });

  it('splits WMI (1–3), VDS (4–9) and VIS (10–17) (ISO 3779)', () => {
    expect(checkVin('1G4AH59H45G118341')).toMatchObject({ wmi: '1G4', vds: 'AH59H4', vis: '5G118341' });
  });

  it('a remainder of 10 is written X: 1M8GDM9AXKP042788 (Σ 351) is valid; 11111111111111111 (Σ 89, check 1) is valid', () => {
    expect(checkVin('1M8GDM9AXKP042788').valid).toBe(true);
    expect(checkVin('11111111111111111').valid).toBe(true);
  });

  it('a changed character breaks the check digit: 1M8GDM9AXKP042789 (Σ 353 → 1, not X) and 1M8GDM9A1KP042788 are invalid', () => {
    const changed = checkVin('1M8GDM9AXKP042789');
    expect(changed.valid).toBe(false);
    expect(changed.problems[0]).toMatch(/should be 1/);
    expect(checkVin('1M8GDM9A1KP042788').valid).toBe(false);
  });

  it('I, O and Q are never used; wrong lengths are refused', () => {
    const withO = checkVin('1G4AH59H4OG118341');
    expect(withO.valid).toBe(false);
    expect(withO.problems[0]).toMatch(/never uses O/);
    expect(checkVin('1G4AH59H45G11834').problems[0]).toMatch(/17 characters; this has 16/);
    expect(checkVin('1G4AH59H45G1183411').valid).toBe(false);
    expect(checkVin('1G4AH59H45G11834*').problems[0]).toMatch(/only letters and digits/);
  });

  it('lower case, spaces and dashes are normalised, not refused (our decision: VINs are read off plates)', () => {
    const check = checkVin(' 1m8gdm9axkp042788 ');
    expect(check.vin).toBe('1M8GDM9AXKP042788');
    expect(check.valid).toBe(true);
    expect(checkVin('1G4-AH59H4-5G118341').valid).toBe(true);
  });

  it('a VIN from outside North America without a check digit is reported, not rejected', () => {
    // An invented European-style VIN: WMI starting with W, 9th character not a check digit.
    const check = checkVin('WXY12345Z6A123456');
    expect(check.valid).toBe(true);
    expect(check.checkDigit?.required).toBe(false);
    expect(check.checkDigit?.matches).toBe(false);
    expect(check.notes[0]).toMatch(/need not carry one/);
  });

  it('refuses a non-string', () => {
    expect(() => checkVin(42 as unknown as string)).toThrow(/must be text/);
  });
});

describe('normaliseRegistration (plates of the demo)', () => {
  it('drops spaces and dashes and upper-cases', () => {
    expect(normaliseRegistration('qk19 fen')).toBe('QK19FEN');
    expect(normaliseRegistration('QK19-FEN')).toBe('QK19FEN');
  });

  it('refuses nothing plate-like', () => {
    expect(() => normaliseRegistration('  ')).toThrow(/not a registration/);
    expect(() => normaliseRegistration('AB12*CD')).toThrow(/not a registration/);
  });
});
