// SAE J300 grades (limits as reproduced for J300 2015-01, unchanged in J300_202405 per
// TRADE-REFERENCES §3) and the jug fill plan.
import { describe, expect, it } from 'vitest';
import { oilFillPlan, parseOilGrade } from '../../../src/lib/trade';

describe('parseOilGrade', () => {
  it('normalises spacing, case, dashes and the SAE prefix: "5W-30", "SAE 5W-30", "5w30", "5W – 30" (TRADE-REFERENCES §3)', () => {
    for (const text of ['5W-30', 'SAE 5W-30', '5w30', '5W \u2013 30', ' sae5w-30 ']) {
      expect(parseOilGrade(text).grade).toBe('5W-30');
    }
  });

  it('accepts the J300 grades 0W-8, 0W-16, 10W-60, 20W-20 and monogrades 30, 16, 8, 20W', () => {
    expect(parseOilGrade('0W-8').grade).toBe('0W-8');
    expect(parseOilGrade('0W-16').grade).toBe('0W-16');
    expect(parseOilGrade('10W-60').grade).toBe('10W-60');
    expect(parseOilGrade('20W-20').grade).toBe('20W-20');
    expect(parseOilGrade('30')).toMatchObject({ grade: '30', kind: 'summer', winter: null, summer: 30 });
    expect(parseOilGrade('16').kind).toBe('summer');
    expect(parseOilGrade('SAE 8').grade).toBe('8');
    expect(parseOilGrade('20w')).toMatchObject({ grade: '20W', kind: 'winter', summer: null });
  });

  it('rejects numbers J300 does not define, saying which: 7W-30, 5W-35, 5W-25, 30W-40', () => {
    expect(() => parseOilGrade('7W-30')).toThrow(/SAE J300 defines no 7W grade/);
    expect(() => parseOilGrade('5W-35')).toThrow(/SAE J300 defines no 35 grade/);
    expect(() => parseOilGrade('5W-25')).toThrow(/SAE J300 defines no 25 grade/);
    expect(() => parseOilGrade('30W-40')).toThrow(/no 30W grade/);
    expect(() => parseOilGrade('10-40')).toThrow(/not an SAE J300 grade/);
    expect(() => parseOilGrade('')).toThrow(/not an SAE J300 grade/);
    expect(() => parseOilGrade(null as unknown as string)).toThrow(/must be text/);
  });

  it('rejects 25W-20: 25W needs KV100 ≥ 9.3 mm²/s but SAE 20 must stay below 9.3 (J300 multigrade rule, TRADE-REFERENCES §3)', () => {
    expect(() => parseOilGrade('25W-20')).toThrow(/25W-20 cannot exist/);
    expect(parseOilGrade('25W-30').grade).toBe('25W-30');
  });

  it('5W-30 limits: CCS ≤ 6600 mPa·s at −30 °C, MRV ≤ 60 000 at −35 °C, 9.3 ≤ KV100 < 12.5 mm²/s, HTHS ≥ 2.9 mPa·s (J300 tables)', () => {
    expect(parseOilGrade('5W-30').limits).toEqual({
      kv100MinMm2s: 9.3,
      kv100BelowMm2s: 12.5,
      hthsMinMPas: 2.9,
      crankingMaxMPas: 6600,
      crankingAtC: -30,
      pumpingMaxMPas: 60000,
      pumpingAtC: -35,
    });
  });

  it('HTHS of SAE 40: 3.5 mPa·s for 0W-40, 5W-40, 10W-40 and 3.7 for 15W-40 and mono 40 (J300_200711 revision)', () => {
    expect(parseOilGrade('10W-40').limits.hthsMinMPas).toBe(3.5);
    expect(parseOilGrade('0W-40').limits.hthsMinMPas).toBe(3.5);
    expect(parseOilGrade('15W-40').limits.hthsMinMPas).toBe(3.7);
    expect(parseOilGrade('40').limits.hthsMinMPas).toBe(3.7);
  });

  it('a multigrade takes the higher KV100 minimum of its two halves; SAE 20 minimum is 6.9 since 2013; 0W-8 HTHS 1.7', () => {
    expect(parseOilGrade('0W-20').limits.kv100MinMm2s).toBe(6.9);
    expect(parseOilGrade('15W-8').limits.kv100MinMm2s).toBe(5.6);
    expect(parseOilGrade('0W-8').limits.hthsMinMPas).toBe(1.7);
    expect(parseOilGrade('20W').limits).toMatchObject({ kv100MinMm2s: 5.6, kv100BelowMm2s: null, hthsMinMPas: null, crankingAtC: -15 });
  });
});

describe('oilFillPlan', () => {
  it('2.8 L with a 1 L jug is 1 + 1 + 0.8 (the issue\'s worked example), with no binary rounding', () => {
    const plan = oilFillPlan({ capacityL: 2.8, jugL: 1 });
    expect(plan.pours).toEqual([1, 1, 0.8]);
    expect(plan.fullJugs).toBe(2);
    expect(plan.lastPourL).toBe(0.8);
    expect(plan.topUpL).toBeNull();
  });

  it('an exact number of jugs leaves no part pour; a jug larger than the capacity is one pour', () => {
    expect(oilFillPlan({ capacityL: 4, jugL: 1 }).pours).toEqual([1, 1, 1, 1]);
    expect(oilFillPlan({ capacityL: 4.25, jugL: 2 }).pours).toEqual([2, 2, 0.25]);
    expect(oilFillPlan({ capacityL: 0.6, jugL: 1 }).pours).toEqual([0.6]);
  });

  it('the pours always add up to the capacity to the millilitre', () => {
    for (const capacityL of [3.3, 4.7, 5.15, 6.05, 7.999]) {
      for (const jugL of [0.5, 1, 2, 5]) {
        const total = oilFillPlan({ capacityL, jugL }).pours.reduce((a, b) => a + b * 1000, 0);
        expect(Math.round(total)).toBe(Math.round(capacityL * 1000));
      }
    }
  });

  it('top-up between the dipstick marks: the whole span from the lower mark, less from part-way', () => {
    expect(oilFillPlan({ capacityL: 4.5, jugL: 1, dipstickSpanL: 1 }).topUpL).toBe(1);
    expect(oilFillPlan({ capacityL: 4.5, jugL: 1, dipstickSpanL: 1, levelBetweenMarks: 0.25 }).topUpL).toBe(0.75);
    expect(oilFillPlan({ capacityL: 4.5, jugL: 1, dipstickSpanL: 1.2, levelBetweenMarks: 1 }).topUpL).toBe(0);
  });

  it('refuses bad input with a reason', () => {
    expect(() => oilFillPlan({ capacityL: 0, jugL: 1 })).toThrow(/oil capacity.*more than zero/);
    expect(() => oilFillPlan({ capacityL: 4, jugL: -1 })).toThrow(/jug size.*more than zero/);
    expect(() => oilFillPlan({ capacityL: Number.NaN, jugL: 1 })).toThrow(/must be a number/);
    expect(() => oilFillPlan({ capacityL: 80, jugL: 1 })).toThrow(/more than any car engine holds/);
    expect(() => oilFillPlan({ capacityL: 4, jugL: 1, dipstickSpanL: 1, levelBetweenMarks: 1.5 })).toThrow(/from 0 \(lower mark\) to 1/);
  });
});
