// 12 V lead-acid battery: BCI open-circuit voltage table (12.65 / 12.45 / 12.24 / 12.06 / 11.89 V
// for 100 / 75 / 50 / 25 / 0 %, at 80 °F; [FOUND-2] in TRADE-REFERENCES §5.1, confirmed on a stored
// page marked "[Source: BCI]"). Charging and voltage-drop windows are common practice (§5.2).
import { describe, expect, it } from 'vitest';
import { batteryStateOfCharge, judgeChargingVoltage, judgeEarthVoltageDrop } from '../../../src/lib/trade';

describe('batteryStateOfCharge (BCI table, linear between rows)', () => {
  it.each([
    [12.65, 100],
    [12.45, 75],
    [12.24, 50],
    [12.06, 25],
  ])('%f V at rest is %i % (a table row)', (volts, percent) => {
    expect(batteryStateOfCharge(volts).stateOfChargePercent).toBe(percent);
  });

  it('12.345 V is 62.5 %, half way between the 75 % and 50 % rows (TRADE-REFERENCES §5.1 check case)', () => {
    expect(batteryStateOfCharge(12.345).stateOfChargePercent).toBe(62.5);
  });

  it('11.80 V is clamped to 0 %, discharged; 11.89 V (the bottom row) is 0 %', () => {
    expect(batteryStateOfCharge(11.8)).toMatchObject({ stateOfChargePercent: 0, clamped: 'discharged', severity: 'soon' });
    expect(batteryStateOfCharge(11.89).stateOfChargePercent).toBe(0);
  });

  it('above 12.65 V is 100 %, and above 12.9 V it asks to re-measure (surface charge)', () => {
    expect(batteryStateOfCharge(12.7)).toMatchObject({ stateOfChargePercent: 100, clamped: 'above_table', severity: 'ok' });
    expect(batteryStateOfCharge(13.1).message).toMatch(/surface charge/);
  });

  it('12.50 V at 60 °F compensates to 12.452 V, about 75 % (BCI: 0.024 V per 10 °F from 80 °F; §5.1 check case)', () => {
    const soc = batteryStateOfCharge(12.5, { electrolyteC: (60 - 32) * (5 / 9) });
    expect(soc.compensatedVolts).toBeCloseTo(12.452, 6);
    // 12.452 V lies 0.002 V above the 75 % row (12.45 V), a hair over 75 %.
    expect(soc.stateOfChargePercent).toBeGreaterThanOrEqual(75);
    expect(soc.stateOfChargePercent).toBeLessThan(75.5);
  });

  it('severity: 75 % and above ok, 50–75 % watch, under 50 % soon (common practice)', () => {
    expect(batteryStateOfCharge(12.45).severity).toBe('ok');
    expect(batteryStateOfCharge(12.44).severity).toBe('watch');
    expect(batteryStateOfCharge(12.23).severity).toBe('soon');
  });

  it('refuses readings that are not a 12 V battery at rest', () => {
    expect(() => batteryStateOfCharge(Number.NaN)).toThrow(/must be a number/);
    expect(() => batteryStateOfCharge(-1)).toThrow(/more than zero/);
    expect(() => batteryStateOfCharge(24.8)).toThrow(/not a 12 V battery/);
  });
});

describe('judgeChargingVoltage (common practice window 13.5–14.8 V)', () => {
  it('14.2 V is fine; 12.7 V is not charging; 15.4 V is overcharging (TRADE-REFERENCES §5.2 check cases)', () => {
    expect(judgeChargingVoltage(14.2)).toMatchObject({ status: 'ok', severity: 'ok' });
    expect(judgeChargingVoltage(12.7)).toMatchObject({ status: 'not_charging', severity: 'now' });
    expect(judgeChargingVoltage(15.4)).toMatchObject({ status: 'overcharging', severity: 'now' });
  });

  it('the window edges: 13.5 and 14.8 pass; 13.2 is low; 14.9 is high; the window is a parameter (13.0–15.0 V makers\' window)', () => {
    expect(judgeChargingVoltage(13.5).status).toBe('ok');
    expect(judgeChargingVoltage(14.8).status).toBe('ok');
    expect(judgeChargingVoltage(13.2).status).toBe('low');
    expect(judgeChargingVoltage(14.9).status).toBe('high');
    expect(judgeChargingVoltage(13.2, { minV: 13.0, maxV: 15.0 }).status).toBe('ok');
    expect(() => judgeChargingVoltage(14, { minV: 15, maxV: 13 })).toThrow(/lower to a higher/);
  });
});

describe('judgeEarthVoltageDrop (common practice limit 0.2 V, 0.3 V in some manuals)', () => {
  it('0.15 V passes; 0.25 V fails at 0.2 V and passes at 0.3 V (TRADE-REFERENCES §5.2 check cases)', () => {
    expect(judgeEarthVoltageDrop(0.15).status).toBe('ok');
    expect(judgeEarthVoltageDrop(0.25)).toMatchObject({ status: 'too_high', severity: 'soon' });
    expect(judgeEarthVoltageDrop(0.25, 0.3).status).toBe('ok');
    expect(judgeEarthVoltageDrop(0.2).status).toBe('ok');
  });

  it('refuses negative drops and a zero limit', () => {
    expect(() => judgeEarthVoltageDrop(-0.1)).toThrow(/cannot be negative/);
    expect(() => judgeEarthVoltageDrop(0.1, 0)).toThrow(/more than zero/);
  });
});
