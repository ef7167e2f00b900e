// The shared schemas that check a form in the browser and the body at the endpoint.
import { describe, expect, it } from 'vitest';
import { clockTime, optionalNumber } from '../../../src/lib/office/form-values';
import { localClock, localInstant, weekOf } from '../../../src/lib/office/local-time';
import { formatMajorAmount } from '../../../src/lib/office/money-input';
import { templateItemInput } from '../../../src/lib/office/template-input';
import { vehicleInput } from '../../../src/lib/office/vehicle-input';

describe('form values', () => {
  it('reads an empty field as unknown, never zero', () => {
    const torque = optionalNumber({ min: 1, max: 300 });
    expect(torque.parse('')).toBeNull();
    expect(torque.parse(null)).toBeNull();
    expect(torque.parse('35')).toBe(35);
    expect(torque.parse('12,5')).toBe(12.5);
    expect(torque.safeParse('0').success).toBe(false);
    expect(torque.safeParse('lots').error?.issues[0]?.message).toBe('is not a number');
  });

  it('reads a 24-hour time as minutes after midnight', () => {
    expect(clockTime.parse('08:30')).toBe(510);
    expect(clockTime.parse('24:00')).toBe(1440);
    expect(clockTime.safeParse('8.30').success).toBe(false);
    expect(clockTime.safeParse('25:00').success).toBe(false);
  });
});

describe('the business’s clock', () => {
  it('turns a local day and time into the right instant across summer time', () => {
    expect(localInstant('2031-01-06', 9 * 60, 'Europe/London').toISOString()).toBe('2031-01-06T09:00:00.000Z');
    expect(localInstant('2031-07-07', 9 * 60, 'Europe/London').toISOString()).toBe('2031-07-07T08:00:00.000Z');
    expect(localClock(new Date('2031-07-07T23:30:00Z'), 'Europe/London')).toEqual({ date: '2031-07-08', minute: 30 });
  });

  it('gives the ISO week (Monday first) holding a day', () => {
    expect(weekOf('2031-03-06')).toEqual(['2031-03-03', '2031-03-04', '2031-03-05', '2031-03-06', '2031-03-07', '2031-03-08', '2031-03-09']);
    expect(weekOf('2031-03-09')[0]).toBe('2031-03-03');
  });
});

describe('money written back into a form', () => {
  it('uses the currency’s own number of decimals (ISO 4217: two for GBP, none for JPY)', () => {
    expect(formatMajorAmount(6205, 'GBP')).toBe('62.05');
    expect(formatMajorAmount(6200, 'GBP')).toBe('62.00');
    expect(formatMajorAmount(6200, 'JPY')).toBe('6200');
  });
});

describe('checklist items', () => {
  const item = (over: Record<string, unknown>) => ({ kind: 'check', label: 'x', unit: '', expectedMin: '', expectedMax: '', rule: '', partKind: '', caution: '', hint: '', ...over });
  it('accepts a reading with a UCUM unit, a range and a trade rule', () => {
    expect(templateItemInput.parse(item({ kind: 'reading', unit: 'mm', expectedMin: '1.6', expectedMax: '12', rule: 'tread_depth' }))).toMatchObject({
      unit: 'mm',
      expectedMin: 1.6,
      expectedMax: 12,
      rule: 'tread_depth',
      caution: null,
    });
  });
  it('refuses a unit that is not one a reading may carry', () => {
    expect(templateItemInput.safeParse(item({ kind: 'reading', unit: 'furlong' })).error?.issues[0]?.path).toEqual(['unit']);
  });
});

describe('vehicle input with the trade checks', () => {
  const base = { customerId: '6f1d1b7e-3c1a-4a8e-9a57-1c2b3d4e5f60', registration: 'qk19 fen', vin: '', make: 'Corvane', model: 'Pippet', engine: '', fuel: 'petrol', year: '', odometerUnit: 'km', oilGrade: '', oilCapacityL: '', oilFilterPartId: '', airFilterPartId: '', cabinFilterPartId: '', fuelFilterPartId: '', sparkPlugPartId: '', sparkPlugCount: '', plugThread: '', plugSeat: '', plugGapMm: '', plugTorqueNm: '', sumpPlugTorqueNm: '', wheelNutTorqueNm: '', brakeFluidGrade: '', tyrePressureFrontKpa: '', tyrePressureRearKpa: '', specialTools: '', serviceIntervalMonths: '', serviceIntervalDistance: '', lastServiceDate: '', lastServiceOdometer: '' };
  it('keeps a VIN from outside North America whose 9th character is no check digit (ISO 3779 allows it)', () => {
    // The demo's XFNAH52B7KM104211: a European-style WMI, so the check digit is not required.
    expect(vehicleInput.parse({ ...base, vin: 'xfnah52b7km104211' }).vin).toBe('XFNAH52B7KM104211');
  });
  it('refuses a VIN of the wrong length, naming the field', () => {
    const issue = vehicleInput.safeParse({ ...base, vin: '1G4AH59H45G11834' }).error?.issues[0];
    expect(issue?.path).toEqual(['vin']);
    expect(issue?.message).toMatch(/17 characters/);
  });
  it('normalises the plate and the oil grade (SAE J300 label "5w30" is 5W-30)', () => {
    const parsed = vehicleInput.parse({ ...base, oilGrade: '5w30', specialTools: ' 14 mm socket \n\n' });
    expect(parsed).toMatchObject({ registration: 'QK19FEN', oilGrade: '5W-30', specialTools: ['14 mm socket'], vin: null, year: null });
  });
});
