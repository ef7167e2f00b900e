// Torque wrench checks (ISO 6789) and spark-plug tightening guidance (makers' charts: common practice).
import { describe, expect, it } from 'vitest';
import { checkTorqueWrench, sparkPlugTightening } from '../../../src/lib/trade';

describe('checkTorqueWrench', () => {
  it('25 N·m on a 19–110 N·m wrench is on the scale but in its bottom fifth (ISO 6789-1:2017 range from the lowest marked value; bottom fifth: common practice)', () => {
    const check = checkTorqueWrench({ targetNm: 25, wrenchMinNm: 19, wrenchMaxNm: 110 });
    expect(check.onScale).toBe(true);
    expect(check.position).toBe('weakest_fifth');
    // The bottom fifth of the marked span: 19 + (110 − 19) / 5 = 37.2 N·m.
    expect(check.weakestFifthBelowNm).toBeCloseTo(37.2, 10);
    expect(check.warnings[0]).toMatch(/bottom fifth/);
  });

  it('20 N·m on a 19–110 N·m wrench is on the scale under the 2017 edition (TRADE-REFERENCES §1.3; the 2003 rule would have refused it)', () => {
    expect(checkTorqueWrench({ targetNm: 20, wrenchMinNm: 19, wrenchMaxNm: 110 }).onScale).toBe(true);
  });

  it('the lowest marked value and the maximum themselves are on the scale; just outside is not', () => {
    expect(checkTorqueWrench({ targetNm: 19, wrenchMinNm: 19, wrenchMaxNm: 110 }).onScale).toBe(true);
    expect(checkTorqueWrench({ targetNm: 110, wrenchMinNm: 19, wrenchMaxNm: 110 }).position).toBe('on_scale');
    expect(checkTorqueWrench({ targetNm: 18.9, wrenchMinNm: 19, wrenchMaxNm: 110 }).position).toBe('below_scale');
    expect(checkTorqueWrench({ targetNm: 110.1, wrenchMinNm: 19, wrenchMaxNm: 110 }).position).toBe('above_scale');
  });

  it('the bottom fifth ends exactly at min + 20 % of the span', () => {
    // 20–100 N·m: 20 + 16 = 36 N·m.
    expect(checkTorqueWrench({ targetNm: 35.9, wrenchMinNm: 20, wrenchMaxNm: 100 }).position).toBe('weakest_fifth');
    expect(checkTorqueWrench({ targetNm: 36, wrenchMinNm: 20, wrenchMaxNm: 100 }).position).toBe('on_scale');
  });

  it('30 N·m on a 40–200 N·m wrench is below the scale (TRADE-REFERENCES §1.3)', () => {
    const check = checkTorqueWrench({ targetNm: 30, wrenchMinNm: 40, wrenchMaxNm: 200 });
    expect(check.onScale).toBe(false);
    expect(check.position).toBe('below_scale');
    expect(check.warnings[0]).toMatch(/below this wrench's lowest marked value \(40 N·m\)/);
  });

  it('±4 % for a wrench whose maximum is above 10 N·m; the band relates to the reference reading: 25 N·m → 24.038 … 26.042 N·m (ISO 6789-1:2017 Type II class A; ISO 6789-2 a = (set − ref) / ref; TRADE-REFERENCES §1.3)', () => {
    const check = checkTorqueWrench({ targetNm: 25, wrenchMinNm: 20, wrenchMaxNm: 100 });
    expect(check.permissibleDeviationPercent).toBe(4);
    expect(check.appliedBandNm.min).toBeCloseTo(25 / 1.04, 10);
    expect(check.appliedBandNm.max).toBeCloseTo(25 / 0.96, 10);
    expect(check.appliedBandNm.min).toBeCloseTo(24.038, 3);
    expect(check.appliedBandNm.max).toBeCloseTo(26.042, 3);
  });

  it('a reference reading of 24.00 N·m at a 25 N·m setting is outside the band, 24.05 inside (+4.17 % vs +3.95 %, TRADE-REFERENCES §1.3)', () => {
    const { appliedBandNm } = checkTorqueWrench({ targetNm: 25, wrenchMinNm: 20, wrenchMaxNm: 100 });
    expect(24.0 >= appliedBandNm.min).toBe(false);
    expect(24.05 >= appliedBandNm.min).toBe(true);
  });

  it('±6 % when the maximum is 10 N·m or less, even at a 4 N·m setting: 3.774 … 4.255 N·m (ISO 6789-1 as summarised; threshold on the tool maximum)', () => {
    const small = checkTorqueWrench({ targetNm: 4, wrenchMinNm: 1, wrenchMaxNm: 5 });
    expect(small.permissibleDeviationPercent).toBe(6);
    expect(small.appliedBandNm.min).toBeCloseTo(3.774, 3);
    expect(small.appliedBandNm.max).toBeCloseTo(4.255, 3);
    expect(checkTorqueWrench({ targetNm: 8, wrenchMinNm: 2, wrenchMaxNm: 10 }).permissibleDeviationPercent).toBe(6);
    expect(checkTorqueWrench({ targetNm: 8, wrenchMinNm: 5, wrenchMaxNm: 25 }).permissibleDeviationPercent).toBe(4);
  });

  it('refuses impossible wrenches and targets with a reason', () => {
    expect(() => checkTorqueWrench({ targetNm: 25, wrenchMinNm: 110, wrenchMaxNm: 19 })).toThrow(/must be above its lowest marked value/);
    expect(() => checkTorqueWrench({ targetNm: Number.NaN, wrenchMinNm: 19, wrenchMaxNm: 110 })).toThrow(/target torque.*must be a number/);
    expect(() => checkTorqueWrench({ targetNm: -5, wrenchMinNm: 19, wrenchMaxNm: 110 })).toThrow(/more than zero/);
    expect(() => checkTorqueWrench({ targetNm: 25, wrenchMinNm: 0, wrenchMaxNm: 110 })).toThrow(/lowest marked value.*more than zero/);
  });
});

describe('sparkPlugTightening (plug makers\' charts: common practice)', () => {
  it('M14 flat seat (gasket) in an aluminium head: 25–29 N·m, ½ turn new (TRADE-REFERENCES §9 check case)', () => {
    const g = sparkPlugTightening({ thread: 'M14', seat: 'flat', head: 'aluminium' });
    expect(g.torqueNm).toEqual({ min: 25, max: 29 });
    expect(g.turnAngleDeg).toBe(180);
    expect(g.source).toMatch(/common practice/);
  });

  it('M14 taper seat in an aluminium head: 10–20 N·m and 1/16 turn (22.5°)', () => {
    const g = sparkPlugTightening({ thread: 'M14', seat: 'taper', head: 'aluminium' });
    expect(g.torqueNm).toEqual({ min: 10, max: 20 });
    expect(g.turnAngleDeg).toBe(22.5);
  });

  it('a re-used gasket plug turns 1/12 (30°); "M14x1.25" reads as M14; cast iron M14 is 25–34 N·m', () => {
    const g = sparkPlugTightening({ thread: 'm14 x 1.25', seat: 'flat', head: 'cast_iron', reusedGasket: true });
    expect(g.thread).toBe('M14');
    expect(g.turnAngleDeg).toBe(30);
    expect(g.torqueNm).toEqual({ min: 25, max: 34 });
  });

  it('says so when the makers publish no figure, and refuses unknown threads', () => {
    expect(sparkPlugTightening({ thread: 'M8', seat: 'flat', head: 'aluminium' }).torqueNm).toBeNull();
    expect(sparkPlugTightening({ thread: 'M10', seat: 'taper', head: 'cast_iron' }).notes.join(' ')).toMatch(/vehicle maker's figure/);
    expect(() => sparkPlugTightening({ thread: 'M16', seat: 'flat', head: 'aluminium' })).toThrow(/not a spark-plug thread/);
  });
});
