import { describe, expect, it } from 'vitest';
import { oilGradeKey, partsNeededForVisit, type VehicleForParts } from '../../../src/lib/trade/parts-needed';

const items = [
  { id: 'i-oil', label: 'Engine oil drained and refilled', partKind: 'oil' },
  { id: 'i-of', label: 'Oil filter replaced', partKind: 'oil_filter' },
  { id: 'i-af', label: 'Air filter replaced', partKind: 'air_filter' },
  { id: 'i-sp', label: 'Spark plugs replaced (petrol)', partKind: 'spark_plug' },
  { id: 'i-ff', label: 'Fuel filter replaced (diesel)', partKind: 'fuel_filter' },
  { id: 'i-cf', label: 'Cabin filter replaced', partKind: 'cabin_filter' },
  { id: 'i-wb', label: 'Wiper blades', partKind: 'wiper' },
];
const oils = [
  { id: 'oil-0w20', partNumber: 'LUB-0W20', oilGrade: '0W-20' },
  { id: 'oil-5w30', partNumber: 'LUB-5W30', oilGrade: '5W-30' },
];
const petrol: VehicleForParts = {
  registration: 'QK19FEN',
  fuel: 'petrol',
  oilGrade: '0W-20',
  oilCapacityL: 3.2,
  oilFilterPartId: 'of',
  airFilterPartId: 'af',
  cabinFilterPartId: 'cf',
  fuelFilterPartId: null,
  sparkPlugPartId: 'sp',
  sparkPlugCount: 3,
};

describe('partsNeededForVisit', () => {
  it('takes the oil by grade and capacity, and each filter and plug the spec names', () => {
    expect(partsNeededForVisit(petrol, items, oils)).toEqual({
      needs: [
        { itemId: 'i-oil', partId: 'oil-0w20', quantity: 3.2 },
        { itemId: 'i-of', partId: 'of', quantity: 1 },
        { itemId: 'i-af', partId: 'af', quantity: 1 },
        { itemId: 'i-sp', partId: 'sp', quantity: 3 },
        { itemId: 'i-cf', partId: 'cf', quantity: 1 },
      ],
      gaps: [],
    });
  });

  it('asks no spark plugs of a diesel, which has none (compression ignition)', () => {
    const diesel = { ...petrol, fuel: 'diesel', oilGrade: '5W-30', sparkPlugPartId: null, sparkPlugCount: null, fuelFilterPartId: 'ff' };
    const result = partsNeededForVisit(diesel, items, oils);
    expect(result.gaps).toEqual([]);
    expect(result.needs.map((n) => n.partId)).toEqual(['oil-5w30', 'of', 'af', 'ff', 'cf']);
  });

  it('reports what the spec lacks for its fuel: a petrol car without plugs, a diesel without a fuel filter', () => {
    expect(partsNeededForVisit({ ...petrol, sparkPlugPartId: null }, items, oils).gaps).toEqual([
      'QK19FEN: the spec has no spark plug part or count',
    ]);
    const diesel = { ...petrol, fuel: 'diesel', sparkPlugPartId: null, sparkPlugCount: null };
    expect(partsNeededForVisit(diesel, items, oils).gaps).toEqual([
      'QK19FEN: the spec names no fuel filter (Fuel filter replaced (diesel))',
    ]);
  });

  it('reports an oil grade the catalogue does not stock, and a spec without oil data', () => {
    expect(partsNeededForVisit({ ...petrol, oilGrade: '10W-40' }, items, oils).gaps).toEqual([
      'QK19FEN: no 10W-40 oil in the parts catalogue',
    ]);
    expect(partsNeededForVisit({ ...petrol, oilCapacityL: null }, items, oils).gaps).toEqual([
      'QK19FEN: the spec has no oil grade or capacity',
    ]);
  });

  it('asks no oil, oil filter or plugs of a battery-electric car', () => {
    const electric = { ...petrol, fuel: 'electric', oilGrade: null, oilCapacityL: null, oilFilterPartId: null, airFilterPartId: null, sparkPlugPartId: null };
    expect(partsNeededForVisit(electric, items, oils)).toEqual({ needs: [{ itemId: 'i-cf', partId: 'cf', quantity: 1 }], gaps: [] });
  });

  it('matches oil grade labels however they are written (SAE J300 names, e.g. "SAE 5W-30")', () => {
    expect(oilGradeKey('SAE 5W-30')).toBe(oilGradeKey('5w30'));
    expect(partsNeededForVisit({ ...petrol, oilGrade: 'sae 5w30' }, items.slice(0, 1), oils).needs[0]!.partId).toBe('oil-5w30');
  });
});
