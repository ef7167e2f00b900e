// Coolant freezing points. Ethylene glycol: Melinder (IIR, 2010) by mass ([FOUND] in
// TRADE-REFERENCES §6.1), cross-checked against CRC-style handbook values quoted on a public forum
// (10 % → −3.37, 20 % → −7.93, 40 % → −23.84, 60 % → −51.23 °C; [FOUND-2], source named only as
// "a book"). Volume % is converted with densities at 20 °C from memory (EG 1.1135, water 0.9982).
// Propylene glycol: Lange's Handbook 15th ed., Table 5.13, by volume ([FOUND] §6.3).
import { describe, expect, it } from 'vitest';
import { coolantFreezePoint, glycolForProtection } from '../../../src/lib/trade';

// Volume % that gives a mass %: the inverse of the tool's conversion, for building inputs.
const volFromMass = (w: number) => (100 * (w / 1.1135)) / (w / 1.1135 + (100 - w) / 0.9982);

describe('coolantFreezePoint: ethylene glycol', () => {
  it.each([
    [40, -23.8],
    [50, -36.0],
    [60, -51.2],
    [30, -14.6],
  ])('%i %% by mass → %f °C (Melinder 2010 table row)', (mass, expected) => {
    expect(coolantFreezePoint(volFromMass(mass)).freezePointC).toBeCloseTo(expected, 1);
  });

  it.each([
    [10, -3.37],
    [20, -7.93],
    [40, -23.84],
    [60, -51.23],
  ])('%i %% by mass agrees within 0.1 °C with the handbook value %f °C (outside cross-check)', (mass, handbook) => {
    expect(Math.abs(coolantFreezePoint(volFromMass(mass)).freezePointC! - handbook)).toBeLessThanOrEqual(0.1);
  });

  it('interpolates between rows: 42.5 % by mass is half way between −23.8 and −29.5 °C (−26.65, shown to 0.1 °C)', () => {
    expect(Math.abs(coolantFreezePoint(volFromMass(42.5)).freezePointC! - -26.65)).toBeLessThanOrEqual(0.05 + 1e-9);
  });

  it('50 % by volume is 52.7 % by mass and about −39.9 °C for pure glycol; within 3.5 °C of the −37 °C label charts give (§6.2, common practice; concentrates are not pure)', () => {
    const r = coolantFreezePoint(50);
    expect(r.glycolMassPercent).toBe(52.7);
    expect(r.freezePointC).toBeCloseTo(-39.9, 1);
    expect(Math.abs(r.freezePointC! - -37)).toBeLessThan(3.5);
    expect(r.notes.join(' ')).toMatch(/pure glycol/);
  });

  it('0 % is 0 °C; past 60 % by mass (≈57.4 % by volume) the table stops and no value is extrapolated', () => {
    expect(coolantFreezePoint(0).freezePointC).toBe(0);
    const strong = coolantFreezePoint(65);
    expect(strong.freezePointC).toBeNull();
    expect(strong.notes[0]).toMatch(/Stronger than the table goes/);
  });

  it('refuses more than 70 % (ASTM D3306 upper working strength; freezing point rises again) and impossible strengths', () => {
    expect(() => coolantFreezePoint(75)).toThrow(/more than the 70 % limit/);
    expect(() => coolantFreezePoint(-5)).toThrow(/between 0 and 100/);
    expect(() => coolantFreezePoint(Number.NaN)).toThrow(/must be a number/);
  });

  it('warns below 40 % by volume that the inhibitors are too weak', () => {
    expect(coolantFreezePoint(30).notes[0]).toMatch(/corrosion inhibitors/);
  });
});

describe('coolantFreezePoint: propylene glycol (Lange\'s 15th ed., Table 5.13)', () => {
  it('30 % → −12.8 °C; 50 % → −33.3 °C (−27.9 °F) (TRADE-REFERENCES §6.3 check cases)', () => {
    expect(coolantFreezePoint(30, 'propylene').freezePointC).toBe(-12.8);
    const r = coolantFreezePoint(50, 'propylene');
    expect(r.freezePointC).toBe(-33.3);
    expect(r.freezePointF).toBe(-27.9);
  });

  it('interpolates: 47.5 % is half way between −26.7 and −33.3 °C', () => {
    expect(coolantFreezePoint(47.5, 'propylene').freezePointC).toBe(-30);
  });
});

describe('glycolForProtection', () => {
  it('is the inverse of coolantFreezePoint at the table rows', () => {
    for (const target of [-8.0, -14.6, -23.8, -36.0, -51.2]) {
      const need = glycolForProtection(target);
      expect(coolantFreezePoint(need.glycolVolPercent).freezePointC!).toBeLessThanOrEqual(target + 0.05);
    }
    expect(glycolForProtection(-36).glycolMassPercent).toBe(50);
    expect(glycolForProtection(-33.3, 'propylene').glycolVolPercent).toBe(50);
  });

  it('rounds up, so the strength given always protects to the target', () => {
    for (let target = -1; target >= -51; target -= 1.7) {
      const need = glycolForProtection(target);
      expect(coolantFreezePoint(need.glycolVolPercent).freezePointC!).toBeLessThanOrEqual(target + 0.05);
    }
  });

  it('−25 °C needs about 38.5 % by volume, and says to use 40 % anyway; litres for a 6 L system', () => {
    const need = glycolForProtection(-25, 'ethylene', { systemCapacityL: 6 });
    expect(need.glycolVolPercent).toBeCloseTo(38.5, 1);
    expect(need.notes[0]).toMatch(/at least 40 %/);
    expect(need.glycolL).toBeCloseTo(6 * 0.385, 2);
  });

  it('refuses targets above 0 °C or colder than the table reaches', () => {
    expect(() => glycolForProtection(5)).toThrow(/above freezing/);
    expect(() => glycolForProtection(-60)).toThrow(/colder than the table reaches \(-51.2 °C\)/);
    expect(() => glycolForProtection(-40, 'propylene')).toThrow(/-33.3/);
  });
});
