// The shared judgement of readings (phone number pad and office review). The cases of the
// integrator's brief come first; each trade value cites its source beside it.
import { describe, expect, it } from 'vitest';
import { judgeReading, type ReadingContext } from '../../../src/lib/trade';
import { ANNUAL_SERVICE } from '../../../src/db/seed/checklists';

const ctx = (over: Partial<ReadingContext> & Pick<ReadingContext, 'rule' | 'unit'>): ReadingContext => ({ expectedMin: null, expectedMax: null, ...over });
const tread = ctx({ rule: 'tread_depth', unit: 'mm', expectedMin: 1.6, expectedMax: 12 });
const torque = ctx({ rule: 'torque_wrench', unit: 'N.m', expectedMin: 15, expectedMax: 60, wrench: { minNm: 19, maxNm: 110 } });
const grade = ctx({ rule: 'oil_grade', unit: '{grade}' });

describe('judgeReading: the cases of the brief', () => {
  it('tread 1.5 mm (UK) is out of range, now: below the 1.6 mm legal minimum (C&U Regs 1986 reg. 27(1)(g))', () => {
    const j = judgeReading({ value: 1.5 }, tread);
    expect(j).toMatchObject({ verdict: 'out_of_range', suggestedSeverity: 'now' });
    expect(j.messages[0]).toMatch(/legal minimum of 1.6 mm/);
    expect(j.source).toMatch(/reg\. 27/);
  });

  it('tread 2.5 mm is attention, soon (3 mm margin: common practice)', () => {
    expect(judgeReading({ value: 2.5 }, tread)).toMatchObject({ verdict: 'attention', suggestedSeverity: 'soon' });
  });

  it('torque 25 N·m with a 19–110 N·m wrench is attention: the bottom fifth of the scale (common practice)', () => {
    const j = judgeReading({ value: 25 }, torque);
    expect(j.verdict).toBe('attention');
    expect(j.messages[0]).toMatch(/bottom fifth/);
  });

  it('torque 15 N·m with that wrench is out of range: below its lowest marked value (ISO 6789-1:2017)', () => {
    const j = judgeReading({ value: 15 }, torque);
    expect(j.verdict).toBe('out_of_range');
    expect(j.messages[0]).toMatch(/below this wrench's lowest marked value/);
  });

  it('oil grade "5W-35" is invalid: SAE J300 defines no 35 grade', () => {
    const j = judgeReading({ value: '5W-35' }, grade);
    expect(j).toMatchObject({ verdict: 'invalid', suggestedSeverity: null });
    expect(j.messages[0]).toMatch(/SAE J300 defines no 35 grade/);
  });

  it('an oil grade differing from the vehicle\'s spec is attention; the same grade written differently is ok', () => {
    expect(judgeReading({ value: '0W-20' }, { ...grade, vehicle: { oilGrade: '5W-30' } })).toMatchObject({ verdict: 'attention' });
    expect(judgeReading({ value: 'sae 5w30' }, { ...grade, vehicle: { oilGrade: '5W-30' } })).toMatchObject({ verdict: 'ok', suggestedSeverity: 'ok' });
  });

  it('brake fluid 150 °C on a DOT 4 car is out of range, soon: below the 155 °C wet minimum (FMVSS 116 S5.1.2)', () => {
    const j = judgeReading({ value: 150 }, ctx({ rule: 'brake_fluid_boiling', unit: 'Cel', expectedMin: 140, expectedMax: 320, vehicle: { brakeFluidGrade: 'DOT 4' } }));
    expect(j).toMatchObject({ verdict: 'out_of_range', suggestedSeverity: 'soon' });
    expect(j.source).toMatch(/FMVSS No\. 116/);
  });
});

describe('judgeReading: what cannot be recorded', () => {
  it('not a number, an empty field, NaN', () => {
    expect(judgeReading({ value: 'abc' }, tread).verdict).toBe('invalid');
    expect(judgeReading({ value: '' }, tread).verdict).toBe('invalid');
    expect(judgeReading({ value: '1.2.3' }, tread).verdict).toBe('invalid');
    expect(judgeReading({ value: Number.NaN }, tread)).toMatchObject({ verdict: 'invalid', suggestedSeverity: null });
  });

  it('a decimal comma as typed on a phone is read: "2,5" mm', () => {
    expect(judgeReading({ value: '2,5' }, tread).verdict).toBe('attention');
  });

  it('a unit that does not fit the rule is invalid; a unit of the same kind is converted', () => {
    expect(judgeReading({ value: 2 }, ctx({ rule: 'tread_depth', unit: 'V' }))).toMatchObject({ verdict: 'invalid' });
    expect(judgeReading({ value: 2 }, ctx({ rule: 'tread_depth', unit: 'furlong' })).messages[0]).toMatch(/does not fit/);
    // 1/16 in = 1.5875 mm: below the UK 1.6 mm.
    expect(judgeReading({ value: 0.0625 }, ctx({ rule: 'tread_depth', unit: '[in_i]' })).suggestedSeverity).toBe('now');
    // 32 psi ≈ 220.6 kPa against a 220 kPa figure: fine.
    expect(judgeReading({ value: 32 }, ctx({ rule: 'tyre_pressure', unit: '[psi]', vehicle: { tyrePressureFrontKpa: 220 } })).verdict).toBe('ok');
  });

  it('a negative length or voltage is invalid; a negative temperature is not', () => {
    expect(judgeReading({ value: -1 }, tread).verdict).toBe('invalid');
    expect(judgeReading({ value: -30 }, ctx({ rule: 'coolant_protection', unit: 'Cel', expectedMin: -60, expectedMax: -25 })).verdict).toBe('ok');
  });
});

describe('judgeReading: each rule', () => {
  it('used oil against the capacity (common practice: under 75 % or over 110 %)', () => {
    const used = ctx({ rule: 'used_oil', unit: 'L', expectedMin: 0, expectedMax: 12, vehicle: { oilCapacityL: 4.2 } });
    expect(judgeReading({ value: 4.0 }, used).verdict).toBe('ok');
    expect(judgeReading({ value: 3.0 }, used)).toMatchObject({ verdict: 'attention', suggestedSeverity: 'watch' });
    expect(judgeReading({ value: 4.8 }, used)).toMatchObject({ verdict: 'attention', suggestedSeverity: 'soon' });
  });

  it('torque without a wrench setting falls back to the expected range', () => {
    expect(judgeReading({ value: 25 }, { ...torque, wrench: null }).verdict).toBe('ok');
    expect(judgeReading({ value: 70 }, { ...torque, wrench: null })).toMatchObject({ verdict: 'out_of_range', suggestedSeverity: 'watch' });
  });

  it('plug gap against the vehicle figure (±0.1 mm: common practice)', () => {
    const gap = ctx({ rule: 'plug_gap', unit: 'mm', expectedMin: 0.6, expectedMax: 1.3, vehicle: { plugGapMm: 0.8 } });
    expect(judgeReading({ value: 0.9 }, gap).verdict).toBe('ok');
    expect(judgeReading({ value: 1.0 }, gap)).toMatchObject({ verdict: 'attention', suggestedSeverity: 'soon' });
  });

  it('coolant protection warmer than the −25 °C target is out of range, soon; colder than −60 °C is too strong', () => {
    const coolant = ctx({ rule: 'coolant_protection', unit: 'Cel', expectedMin: -60, expectedMax: -25 });
    expect(judgeReading({ value: -18 }, coolant)).toMatchObject({ verdict: 'out_of_range', suggestedSeverity: 'soon' });
    expect(judgeReading({ value: -65 }, coolant).messages[0]).toMatch(/too much glycol/);
  });

  it('brake fluid with an unknown grade is judged against DOT 3 and says so', () => {
    const j = judgeReading({ value: 135 }, ctx({ rule: 'brake_fluid_boiling', unit: 'Cel' }));
    expect(j.suggestedSeverity).toBe('now');
    expect(j.messages[0]).toMatch(/grade unknown/);
  });

  it('battery at rest: 12.65 V ok, 12.3 V attention or worse, 12.0 V out of range (BCI table)', () => {
    const bat = ctx({ rule: 'battery_rest', unit: 'V', expectedMin: 12.4, expectedMax: 12.9 });
    expect(judgeReading({ value: 12.65 }, bat).verdict).toBe('ok');
    expect(judgeReading({ value: 12.3 }, bat).suggestedSeverity).toBe('watch');
    expect(judgeReading({ value: 12.0 }, bat)).toMatchObject({ verdict: 'out_of_range', suggestedSeverity: 'soon' });
    // A reading in millivolts is converted: 12 650 mV.
    expect(judgeReading({ value: 12650 }, ctx({ rule: 'battery_rest', unit: 'mV' })).verdict).toBe('ok');
  });

  it('charging voltage uses the item\'s window; earth drop uses the item\'s maximum as its limit', () => {
    const charging = ctx({ rule: 'charging_voltage', unit: 'V', expectedMin: 13.5, expectedMax: 14.8 });
    expect(judgeReading({ value: 14.2 }, charging).verdict).toBe('ok');
    expect(judgeReading({ value: 12.7 }, charging)).toMatchObject({ verdict: 'out_of_range', suggestedSeverity: 'now' });
    const earth = ctx({ rule: 'earth_drop', unit: 'V', expectedMin: 0, expectedMax: 0.3 });
    expect(judgeReading({ value: 0.25 }, earth).verdict).toBe('ok');
    expect(judgeReading({ value: 0.35 }, earth)).toMatchObject({ verdict: 'out_of_range', suggestedSeverity: 'soon' });
  });

  it('tread depth by region: 1.59 mm is legal in the US (2/32 in), not in the UK', () => {
    expect(judgeReading({ value: 1.59 }, { ...tread, expectedMin: null, region: 'US' }).suggestedSeverity).toBe('soon');
    expect(judgeReading({ value: 1.59 }, tread).suggestedSeverity).toBe('now');
  });

  it('tyre pressure against the axle\'s figure, or the nearer one; 25 % under is serious (FMVSS 138)', () => {
    const vehicle = { tyrePressureFrontKpa: 230, tyrePressureRearKpa: 250 };
    const p = ctx({ rule: 'tyre_pressure', unit: 'kPa', expectedMin: 150, expectedMax: 350, vehicle });
    expect(judgeReading({ value: 250 }, p).verdict).toBe('ok');
    expect(judgeReading({ value: 250 }, { ...p, axle: 'front' }).verdict).toBe('ok');
    expect(judgeReading({ value: 270 }, { ...p, axle: 'front' })).toMatchObject({ verdict: 'attention', suggestedSeverity: 'watch' });
    expect(judgeReading({ value: 170 }, { ...p, axle: 'front' })).toMatchObject({ verdict: 'out_of_range', suggestedSeverity: 'soon' });
  });

  it('brake pads: under 2 mm now, under 3 mm soon (common practice)', () => {
    const pads = ctx({ rule: 'brake_pad', unit: 'mm', expectedMin: 3, expectedMax: 14 });
    expect(judgeReading({ value: 1.5 }, pads)).toMatchObject({ verdict: 'out_of_range', suggestedSeverity: 'now' });
    expect(judgeReading({ value: 2.5 }, pads)).toMatchObject({ verdict: 'out_of_range', suggestedSeverity: 'soon' });
    expect(judgeReading({ value: 8 }, pads)).toMatchObject({ verdict: 'ok', suggestedSeverity: 'ok' });
  });

  it('no rule, or an unknown one: the expected range only', () => {
    const plain = ctx({ rule: null, unit: 'mm', expectedMin: 2, expectedMax: 5 });
    expect(judgeReading({ value: 3 }, plain)).toEqual({ verdict: 'ok', messages: [], suggestedSeverity: 'ok', source: null });
    expect(judgeReading({ value: 6 }, plain)).toMatchObject({ verdict: 'out_of_range', suggestedSeverity: 'watch', messages: ['Above the expected 5 mm.'] });
    expect(judgeReading({ value: 1 }, { ...plain, rule: 'something_new' }).verdict).toBe('out_of_range');
    expect(judgeReading({ value: 'anything' }, ctx({ rule: null, unit: '{grade}' })).verdict).toBe('ok');
  });
});

describe('judgeReading: every rule of the demo checklists is known', () => {
  it('each seeded reading item has a rule judgeReading implements and a unit that fits it', () => {
    const items = ANNUAL_SERVICE.sections.flatMap((s) => s.items).filter((i) => i.kind === 'reading');
    for (const item of items) {
      const sample = item.unit === '{grade}' ? '5W-30' : (item.expectedMin ?? 0) + 0.01;
      const j = judgeReading({ value: sample }, { rule: item.rule ?? null, unit: item.unit!, expectedMin: item.expectedMin ?? null, expectedMax: item.expectedMax ?? null });
      expect(j.verdict, `${item.key}: ${j.messages.join(' ')}`).not.toBe('invalid');
      expect(j.source === null && item.rule !== undefined && !['torque_wrench', 'used_oil', 'plug_gap', 'tyre_pressure'].includes(item.rule), item.key).toBe(false);
    }
  });
});
