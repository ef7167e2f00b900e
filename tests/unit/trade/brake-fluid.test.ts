// Brake fluid boiling point minimums: FMVSS No. 116, 49 CFR 571.116 S5.1.1 (dry ERBP) and S5.1.2
// (wet ERBP). DOT 4 wet 311 °F is confirmed by NHTSA interpretation 12089.MLS (1996); the other
// figures agree across secondary copies of the regulation and match memory of S5.1 ([FOUND-2] +
// [MEM] in TRADE-REFERENCES §4).
import { describe, expect, it } from 'vitest';
import { brakeFluidMinimums, judgeBrakeFluidBoilingPoint } from '../../../src/lib/trade';

describe('brakeFluidMinimums (FMVSS 116 S5.1.1, S5.1.2)', () => {
  it.each([
    ['DOT 3', 205, 140, 401, 284],
    ['DOT 4', 230, 155, 446, 311],
    ['DOT 5', 260, 180, 500, 356],
    ['DOT 5.1', 260, 180, 500, 356],
  ])('%s: dry %i °C, wet %i °C (%i °F / %i °F)', (grade, dry, wet, dryF, wetF) => {
    expect(brakeFluidMinimums(grade)).toMatchObject({ grade, dryMinC: dry, wetMinC: wet, dryMinF: dryF, wetMinF: wetF });
  });

  it('DOT 5 is the silicone grade; DOT 5.1 is glycol based', () => {
    expect(brakeFluidMinimums('DOT 5').silicone).toBe(true);
    expect(brakeFluidMinimums('DOT 5.1').silicone).toBe(false);
  });

  it('reads "dot4", "DOT-4" and " DOT 5.1 "; refuses other grades', () => {
    expect(brakeFluidMinimums('dot4').grade).toBe('DOT 4');
    expect(brakeFluidMinimums('DOT-4').grade).toBe('DOT 4');
    expect(brakeFluidMinimums(' DOT 5.1 ').grade).toBe('DOT 5.1');
    expect(() => brakeFluidMinimums('DOT 6')).toThrow(/not an FMVSS 116 brake fluid grade/);
    expect(() => brakeFluidMinimums('LHM')).toThrow(/DOT 3, DOT 4, DOT 5, DOT 5.1/);
  });
});

describe('judgeBrakeFluidBoilingPoint', () => {
  it('DOT 4 at 160 °C meets the 155 °C wet minimum (TRADE-REFERENCES §4 check case)', () => {
    expect(judgeBrakeFluidBoilingPoint('DOT 4', 160)).toMatchObject({ status: 'in_service', severity: 'ok' });
  });

  it('DOT 4 at 150 °C is below its wet minimum, though above DOT 3\'s 140 °C: replace soon (§4 check case)', () => {
    const j = judgeBrakeFluidBoilingPoint('DOT 4', 150);
    expect(j).toMatchObject({ status: 'below_wet_minimum', severity: 'soon' });
    expect(j.message).toMatch(/below the DOT 4 wet minimum of 155 °C/);
  });

  it('the exact limits: 155 °C on DOT 4 passes wet, 230 °C is as new, 229.9 °C is in service', () => {
    expect(judgeBrakeFluidBoilingPoint('DOT 4', 155).status).toBe('in_service');
    expect(judgeBrakeFluidBoilingPoint('DOT 4', 154.9).status).toBe('below_wet_minimum');
    expect(judgeBrakeFluidBoilingPoint('DOT 4', 230).status).toBe('as_new');
    expect(judgeBrakeFluidBoilingPoint('DOT 4', 229.9).status).toBe('in_service');
  });

  it('below 140 °C, the least any grade may boil at wet, is urgent (our rule on top of FMVSS 116)', () => {
    expect(judgeBrakeFluidBoilingPoint('DOT 4', 130).severity).toBe('now');
    expect(judgeBrakeFluidBoilingPoint('DOT 3', 139).severity).toBe('now');
    expect(judgeBrakeFluidBoilingPoint('DOT 3', 140).severity).toBe('ok');
  });

  it('refuses readings no tester gives', () => {
    expect(() => judgeBrakeFluidBoilingPoint('DOT 4', Number.NaN)).toThrow(/must be a number/);
    expect(() => judgeBrakeFluidBoilingPoint('DOT 4', -10)).toThrow(/not a brake fluid boiling point/);
  });
});
