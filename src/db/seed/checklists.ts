// The demo business's two checklists. Ranges marked "common practice" are rules of thumb of the
// trade, not regulations; each reading's `rule` names the trade judgement applied on the phone
// (src/lib/trade/judge-reading.ts). Cautions are the usual ones of PRODUCT.md.
import type { ItemKind, PartKind } from '../schema';

export type ChecklistItemSeed = {
  key: string;
  kind: ItemKind;
  label: string;
  unit?: string;
  expectedMin?: number;
  expectedMax?: number;
  rule?: string;
  partKind?: PartKind;
  caution?: string;
  hint?: string;
};

export type ChecklistSectionSeed = { title: string; items: ChecklistItemSeed[] };
export type ChecklistSeed = {
  key: string;
  name: string;
  description: string;
  labourCentiHours: number;
  sections: ChecklistSectionSeed[];
};

export const CAUTIONS = {
  raised:
    'Never work under a car held only by a jack. Chock the wheels and put it on axle stands on firm, level ground.',
  hotOil: 'Engine oil and the exhaust can be hot enough to burn. Let them cool; wear gloves and eye protection.',
  brakeFluid:
    'Brake fluid harms skin, eyes and paint. Wear gloves and eye protection; rinse splashes with plenty of water.',
  battery:
    'Batteries give off explosive gas and hold acid. No sparks or flames; disconnect the negative lead first and refit it last.',
  usedOil: 'Used oil and filters are hazardous waste: keep them sealed and take them to a licensed site.',
  coolant: 'Never open a hot cooling system: it is under pressure. Coolant is poisonous; keep it from children and pets.',
  roadTest: 'Road test only where it is safe and legal, with the customer’s permission.',
} as const;

const underneathAnnual: ChecklistSectionSeed = {
  title: 'Underneath',
  items: [
    { key: 'raised-safely', kind: 'check', label: 'Car raised and supported on axle stands', caution: CAUTIONS.raised },
    { key: 'oil-drained', kind: 'part', label: 'Engine oil drained and refilled', unit: 'L', partKind: 'oil', caution: CAUTIONS.hotOil },
    {
      key: 'used-oil',
      kind: 'reading',
      label: 'Used oil drained',
      unit: 'L',
      expectedMin: 0,
      expectedMax: 12,
      rule: 'used_oil',
      caution: CAUTIONS.usedOil,
      hint: 'Prefilled from the oil capacity; change it if you drained more or less.',
    },
    { key: 'oil-filter', kind: 'part', label: 'Oil filter replaced', unit: '{each}', partKind: 'oil_filter', caution: CAUTIONS.hotOil },
    { key: 'sump-plug', kind: 'reading', label: 'Sump plug tightening torque', unit: 'N.m', rule: 'torque_wrench', expectedMin: 15, expectedMax: 60 },
    { key: 'exhaust', kind: 'check', label: 'Exhaust system and mountings', caution: CAUTIONS.hotOil },
    { key: 'lines', kind: 'check', label: 'Brake and fuel pipes along the underside' },
    { key: 'steering-gaiters', kind: 'check', label: 'Steering rack gaiters and track-rod ends' },
    { key: 'suspension', kind: 'check', label: 'Suspension arms, bushes, springs and dampers' },
    { key: 'cv-boots', kind: 'check', label: 'Drive shaft gaiters' },
    { key: 'leaks', kind: 'check', label: 'Oil and fluid leaks' },
  ],
};

const bonnetAnnual: ChecklistSectionSeed = {
  title: 'Under the bonnet',
  items: [
    { key: 'oil-level', kind: 'check', label: 'Oil level on the dipstick after refill' },
    { key: 'oil-grade', kind: 'reading', label: 'Oil grade used', unit: '{grade}', rule: 'oil_grade', hint: 'As printed on the container, e.g. 5W-30.' },
    { key: 'air-filter', kind: 'part', label: 'Air filter replaced', unit: '{each}', partKind: 'air_filter' },
    { key: 'spark-plugs', kind: 'part', label: 'Spark plugs replaced (petrol)', unit: '{each}', partKind: 'spark_plug' },
    { key: 'plug-gap', kind: 'reading', label: 'Spark plug gap', unit: 'mm', expectedMin: 0.6, expectedMax: 1.3, rule: 'plug_gap' },
    { key: 'plug-torque', kind: 'reading', label: 'Spark plug tightening torque', unit: 'N.m', expectedMin: 10, expectedMax: 40, rule: 'torque_wrench' },
    { key: 'fuel-filter', kind: 'part', label: 'Fuel filter replaced (diesel)', unit: '{each}', partKind: 'fuel_filter' },
    { key: 'coolant-level', kind: 'check', label: 'Coolant level and hoses', caution: CAUTIONS.coolant },
    {
      key: 'coolant-protection',
      kind: 'reading',
      label: 'Coolant freeze protection',
      unit: 'Cel',
      expectedMin: -60,
      expectedMax: -25,
      rule: 'coolant_protection',
      caution: CAUTIONS.coolant,
      hint: 'From the refractometer. −25 °C or colder is the common winter target.',
    },
    { key: 'belts', kind: 'check', label: 'Drive belts: condition and tension' },
    { key: 'hoses', kind: 'check', label: 'Hoses and breathers' },
    { key: 'brake-fluid-level', kind: 'check', label: 'Brake and clutch fluid levels', caution: CAUTIONS.brakeFluid },
    {
      key: 'brake-fluid-boiling',
      kind: 'reading',
      label: 'Brake fluid boiling point',
      unit: 'Cel',
      rule: 'brake_fluid_boiling',
      expectedMin: 140,
      expectedMax: 320,
      caution: CAUTIONS.brakeFluid,
    },
    {
      key: 'battery-rest',
      kind: 'reading',
      label: 'Battery resting voltage',
      unit: 'V',
      expectedMin: 12.4,
      expectedMax: 12.9,
      rule: 'battery_rest',
      caution: CAUTIONS.battery,
      hint: 'Engine off for at least an hour, lights off.',
    },
    { key: 'charging', kind: 'reading', label: 'Charging voltage at fast idle', unit: 'V', expectedMin: 13.5, expectedMax: 14.8, rule: 'charging_voltage' },
    { key: 'earth-drop', kind: 'reading', label: 'Earth side voltage drop while cranking', unit: 'V', expectedMin: 0, expectedMax: 0.2, rule: 'earth_drop' },
    { key: 'terminals', kind: 'check', label: 'Battery terminals and earth straps', caution: CAUTIONS.battery },
    { key: 'drains', kind: 'check', label: 'Scuttle and plenum drains clear' },
    { key: 'washer', kind: 'check', label: 'Washer fluid topped up' },
  ],
};

const cabinAnnual: ChecklistSectionSeed = {
  title: 'Cabin',
  items: [
    { key: 'cabin-filter', kind: 'part', label: 'Cabin (pollen) filter replaced', unit: '{each}', partKind: 'cabin_filter' },
    { key: 'warning-lamps', kind: 'check', label: 'Warning lamps on the dashboard' },
    { key: 'horn', kind: 'check', label: 'Horn' },
    { key: 'wipers', kind: 'check', label: 'Wipers and washers, front and rear' },
    { key: 'seat-belts', kind: 'check', label: 'Seat belts and buckles' },
    { key: 'lights', kind: 'check', label: 'Exterior lights and indicators' },
  ],
};

const tread = (corner: string, key: string): ChecklistItemSeed => ({
  key,
  kind: 'reading',
  label: `Tread depth, ${corner}`,
  unit: 'mm',
  expectedMin: 1.6,
  expectedMax: 12,
  rule: 'tread_depth',
  hint: 'Lowest reading across the central three-quarters of the tread.',
});

const wheelsAnnual: ChecklistSectionSeed = {
  title: 'Wheels and brakes',
  items: [
    tread('front left', 'tread-fl'),
    tread('front right', 'tread-fr'),
    tread('rear left', 'tread-rl'),
    tread('rear right', 'tread-rr'),
    { key: 'pressure-front', kind: 'reading', label: 'Tyre pressure, front (cold)', unit: 'kPa', expectedMin: 180, expectedMax: 300, rule: 'tyre_pressure' },
    { key: 'pressure-rear', kind: 'reading', label: 'Tyre pressure, rear (cold)', unit: 'kPa', expectedMin: 180, expectedMax: 300, rule: 'tyre_pressure' },
    {
      key: 'pads-front',
      kind: 'reading',
      label: 'Front brake pad thickness',
      unit: 'mm',
      expectedMin: 3,
      expectedMax: 14,
      rule: 'brake_pad',
      hint: 'Friction material only. Under 3 mm is due soon (common practice).',
    },
    { key: 'pads-rear', kind: 'reading', label: 'Rear brake pad or shoe thickness', unit: 'mm', expectedMin: 3, expectedMax: 14, rule: 'brake_pad' },
    { key: 'discs', kind: 'check', label: 'Brake discs and drums' },
    { key: 'brake-hoses', kind: 'check', label: 'Flexible brake hoses' },
    { key: 'wheel-nuts', kind: 'reading', label: 'Wheel nut tightening torque', unit: 'N.m', expectedMin: 60, expectedMax: 180, rule: 'torque_wrench' },
  ],
};

const roadTest: ChecklistSectionSeed = {
  title: 'Road test',
  items: [
    { key: 'rt-brakes', kind: 'check', label: 'Brakes pull up straight', caution: CAUTIONS.roadTest },
    { key: 'rt-steering', kind: 'check', label: 'Steering and suspension: no knocks or pull' },
    { key: 'rt-engine', kind: 'check', label: 'Engine and gearbox' },
    { key: 'rt-indicator', kind: 'check', label: 'Service indicator reset' },
  ],
};

export const ANNUAL_SERVICE: ChecklistSeed = {
  key: 'annual',
  name: 'Annual service',
  description: 'Oil and all filters, plugs or fuel filter, and the full set of checks.',
  labourCentiHours: 250,
  sections: [underneathAnnual, bonnetAnnual, cabinAnnual, wheelsAnnual, roadTest],
};

const pick = (section: ChecklistSectionSeed, keys: string[]): ChecklistSectionSeed => ({
  title: section.title,
  items: keys.map((key) => {
    const item = section.items.find((i) => i.key === key);
    if (!item) throw new Error(`no item ${key} in ${section.title}`);
    return item;
  }),
});

export const INTERIM_SERVICE: ChecklistSeed = {
  key: 'interim',
  name: 'Interim service',
  description: 'Oil and oil filter, levels, tyres, brakes and lights.',
  labourCentiHours: 125,
  sections: [
    pick(underneathAnnual, ['raised-safely', 'oil-drained', 'used-oil', 'oil-filter', 'sump-plug', 'exhaust', 'leaks']),
    pick(bonnetAnnual, ['oil-level', 'oil-grade', 'coolant-level', 'brake-fluid-level', 'battery-rest', 'washer']),
    pick(cabinAnnual, ['warning-lamps', 'wipers', 'lights']),
    pick(wheelsAnnual, ['tread-fl', 'tread-fr', 'tread-rl', 'tread-rr', 'pressure-front', 'pressure-rear']),
    pick(roadTest, ['rt-brakes']),
  ],
};
