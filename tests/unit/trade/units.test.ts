// Conversions: exact factors from the definitions behind NIST SP 811 (2008), Appendix B.8/B.9,
// checked three ways: expected values built exactly with decimal.js from those definitions,
// TRADE-REFERENCES.md §2 check cases ([DERIVED] there), and the NLM's UCUM library
// (@lhncbc/ucum-lhc) as an outside reference for every pair of units we know.
import Decimal from 'decimal.js';
import ucum from '@lhncbc/ucum-lhc';
import { describe, expect, it } from 'vitest';
import { convert, UNITS, unit, unitsOf } from '../../../src/lib/trade';

Decimal.set({ precision: 40 });
const D = (x: string | number) => new Decimal(x);

// Exact definitions (NIST SP 811 App. B; NIST HB 44 App. C for 231 in³; UK WMA 1985 for 4.546 09 L).
const LBF_N = D('0.45359237').times('9.80665');
const FT_M = D('0.3048');
const IN_M = D('0.0254');
const US_GAL_L = D(231).times(IN_M.times(10).pow(3));
const IMP_GAL_L = D('4.54609');

function closeTo(actual: number, expected: Decimal, relative = 1e-14) {
  const e = expected.toNumber();
  expect(Math.abs(actual - e)).toBeLessThanOrEqual(Math.abs(e) * relative + 1e-300);
}

describe('convert: exact factors (NIST SP 811 App. B definitions, built with decimal.js)', () => {
  it('torque: 25 N·m is 18.439 053 73 lbf·ft and 221.268 644 78 lbf·in (TRADE-REFERENCES §2)', () => {
    closeTo(convert(25, 'N.m', '[lbf_av].[ft_i]'), D(25).div(LBF_N.times(FT_M)));
    closeTo(convert(25, 'N.m', '[lbf_av].[in_i]'), D(25).div(LBF_N.times(IN_M)));
    expect(convert(25, 'N.m', '[lbf_av].[ft_i]')).toBeCloseTo(18.43905373, 8);
    expect(convert(25, 'N.m', '[lbf_av].[in_i]')).toBeCloseTo(221.26864478, 8);
  });

  it('torque: 100 lbf·ft is 135.581 794 833 N·m; 110 N·m is 81.131 836 42 lbf·ft; 3.5 kgf·m is 25.315 548 48 lbf·ft', () => {
    expect(convert(100, '[lbf_av].[ft_i]', 'N.m')).toBeCloseTo(135.581794833, 9);
    expect(convert(110, 'N.m', '[lbf_av].[ft_i]')).toBeCloseTo(81.13183642, 8);
    expect(convert(3.5, 'kgf.m', '[lbf_av].[ft_i]')).toBeCloseTo(25.31554848, 8);
  });

  it('pressure: 1 psi is 6.894 757 293 168 36 kPa exactly; 2.2 bar = 31.908 302 30 psi; 32 psi = 220.632 233 38 kPa; 35 psi = 2.413 165 05 bar', () => {
    closeTo(convert(1, '[psi]', 'kPa'), LBF_N.div(IN_M.pow(2)).div(1000));
    expect(convert(2.2, 'bar', '[psi]')).toBeCloseTo(31.9083023, 7);
    expect(convert(32, '[psi]', 'kPa')).toBeCloseTo(220.63223338, 8);
    expect(convert(35, '[psi]', 'bar')).toBeCloseTo(2.41316505, 8);
    expect(convert(1, 'bar', 'kPa')).toBe(100);
  });

  it('volume: US gallon 3.785 411 784 L, US quart 0.946 352 946 L, imperial gallon 4.546 09 L, imperial pint 0.568 261 25 L (exact)', () => {
    expect(convert(1, '[gal_us]', 'L')).toBe(3.785411784);
    closeTo(convert(1, '[qt_us]', 'L'), US_GAL_L.div(4));
    expect(convert(1, '[gal_br]', 'L')).toBe(4.54609);
    closeTo(convert(1, '[pt_br]', 'L'), IMP_GAL_L.div(8));
  });

  it('volume: 4.5 L is 4.755 096 94 US qt, 1.188 774 24 US gal, 0.989 861 62 imp gal, 7.918 892 94 imp pt (TRADE-REFERENCES §2)', () => {
    expect(convert(4.5, 'L', '[qt_us]')).toBeCloseTo(4.75509694, 8);
    expect(convert(4.5, 'L', '[gal_us]')).toBeCloseTo(1.18877424, 8);
    expect(convert(4.5, 'L', '[gal_br]')).toBeCloseTo(0.98986162, 8);
    expect(convert(4.5, 'L', '[pt_br]')).toBeCloseTo(7.91889294, 8);
    expect(convert(1, '[gal_br]', '[gal_us]')).toBeCloseTo(1.200949926, 9);
    expect(convert(2500, 'mL', 'L')).toBe(2.5);
  });

  it('length: 10 000 mi is exactly 16 093.44 km; 15 000 km is 9 320.567 884 mi; 2/32 in is 1.5875 mm', () => {
    expect(convert(10_000, '[mi_i]', 'km')).toBe(16093.44);
    expect(convert(15_000, 'km', '[mi_i]')).toBeCloseTo(9320.567884, 6);
    expect(convert(2 / 32, '[in_i]', 'mm')).toBe(1.5875);
    expect(convert(1.6, 'mm', '[in_i]')).toBeCloseTo(0.062992, 6);
  });

  it('temperature: −40, 0, 100, 205, 230, 260 °C are −40, 32, 212, 401, 446, 500 °F exactly (NIST SP 811 B.9)', () => {
    const pairs = [[-40, -40], [0, 32], [100, 212], [205, 401], [230, 446], [260, 500]] as const;
    for (const [c, f] of pairs) {
      expect(convert(c, 'Cel', '[degF]')).toBe(f);
      expect(convert(f, '[degF]', 'Cel')).toBe(c);
    }
    expect(convert(0, 'Cel', 'K')).toBe(273.15);
    expect(convert(-459.67, '[degF]', 'K')).toBeCloseTo(0, 10);
  });

  it('electric potential: 200 mV is 0.2 V', () => {
    expect(convert(200, 'mV', 'V')).toBe(0.2);
  });

  it('accepts the other UCUM spelling of a product unit', () => {
    expect(convert(10, '[ft_i].[lbf_av]', 'N.m')).toBe(convert(10, '[lbf_av].[ft_i]', 'N.m'));
  });
});

describe('convert: outside reference (@lhncbc/ucum-lhc, the NLM UCUM library)', () => {
  const lhc = ucum.UcumLhcUtils.getInstance();
  const samples = [0.37, 1, 12.5, 250];
  for (const from of UNITS) {
    for (const to of unitsOf(from.dimension)) {
      it(`${from.code} → ${to.code} agrees with ucum-lhc`, () => {
        for (const value of samples) {
          const reference = lhc.convertUnitTo(from.code, value, to.code);
          expect(reference.status, reference.msg.join('; ')).toBe('succeeded');
          const ours = convert(value, from.code, to.code);
          expect(Math.abs(ours - reference.toVal!)).toBeLessThanOrEqual(Math.abs(reference.toVal!) * 1e-12 + 1e-12);
        }
      });
    }
  }
});

describe('convert: bad input', () => {
  it('refuses units of different kinds, naming both', () => {
    expect(() => convert(25, 'N.m', 'L')).toThrow(/Cannot convert N·m \(torque\) to L \(volume\)/);
    expect(() => convert(1, 'V', 'kPa')).toThrow(/electric potential/);
  });

  it('refuses an unknown unit and lists the known codes', () => {
    expect(() => convert(1, 'Nm', 'N.m')).toThrow(/"Nm" is not a unit Tickover knows.*N\.m/);
    expect(() => unit('furlong')).toThrow(/not a unit/);
  });

  it('refuses NaN, infinity and non-numbers', () => {
    expect(() => convert(Number.NaN, 'L', 'mL')).toThrow(/must be a number, not NaN/);
    expect(() => convert(Number.POSITIVE_INFINITY, 'L', 'mL')).toThrow(/must be a number/);
    expect(() => convert('5' as unknown as number, 'L', 'mL')).toThrow(/must be a number, not "5"/);
  });
});
