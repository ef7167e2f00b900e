// The demo business: invented throughout. Fenwright Mobile Servicing works the fictional town of
// Aldersby with two technicians. Makes, models, part numbers, people and addresses are made up;
// postcodes use the QX area, which no real postal area uses.
import type { PartKind } from '../schema';

export const DEMO_PASSWORD = 'servicing-demo';

export const ORGANISATION = {
  key: 'fenwright',
  name: 'Fenwright Mobile Servicing',
  slug: 'fenwright',
  addressLines: 'Unit 4, Tanner’s Yard, Aldersby',
  phone: '01632 960 418',
  email: 'office@fenwright.example',
  currency: 'GBP',
  taxRateBasisPoints: 2000,
  labourRateMinorPerHour: 6200,
  distanceUnit: '[mi_i]' as const,
  timeZone: 'Europe/London',
};

export const PEOPLE = [
  { key: 'owner', name: 'Marnie Fenwright', email: 'marnie@fenwright.example', role: 'owner' as const },
  { key: 'office', name: 'Priya Castell', email: 'priya@fenwright.example', role: 'office' as const },
  { key: 'tech-tom', name: 'Tom Arkwell', email: 'tom@fenwright.example', role: 'technician' as const },
  { key: 'tech-jess', name: 'Jess Brannock', email: 'jess@fenwright.example', role: 'technician' as const },
];

export type PartSeed = {
  key: string;
  partNumber: string;
  description: string;
  kind: PartKind;
  unit: 'L' | '{each}';
  oilGrade?: string;
  costMinor: number;
  priceMinor: number;
  supplier: string;
};

export const PARTS: PartSeed[] = [
  { key: 'oil-0w20', partNumber: 'LUB-0W20', description: 'Engine oil 0W-20', kind: 'oil', unit: 'L', oilGrade: '0W-20', costMinor: 720, priceMinor: 1250, supplier: 'Brindle Lubricants' },
  { key: 'oil-5w30', partNumber: 'LUB-5W30', description: 'Engine oil 5W-30', kind: 'oil', unit: 'L', oilGrade: '5W-30', costMinor: 640, priceMinor: 1150, supplier: 'Brindle Lubricants' },
  { key: 'oil-5w40', partNumber: 'LUB-5W40', description: 'Engine oil 5W-40', kind: 'oil', unit: 'L', oilGrade: '5W-40', costMinor: 660, priceMinor: 1190, supplier: 'Brindle Lubricants' },
  { key: 'of-118', partNumber: 'OF-118', description: 'Oil filter, spin-on 76 mm', kind: 'oil_filter', unit: '{each}', costMinor: 480, priceMinor: 1100, supplier: 'Aldersby Motor Factors' },
  { key: 'of-204', partNumber: 'OF-204', description: 'Oil filter, cartridge', kind: 'oil_filter', unit: '{each}', costMinor: 620, priceMinor: 1350, supplier: 'Aldersby Motor Factors' },
  { key: 'af-331', partNumber: 'AF-331', description: 'Air filter, panel 245 mm', kind: 'air_filter', unit: '{each}', costMinor: 690, priceMinor: 1500, supplier: 'Aldersby Motor Factors' },
  { key: 'af-352', partNumber: 'AF-352', description: 'Air filter, panel 290 mm', kind: 'air_filter', unit: '{each}', costMinor: 840, priceMinor: 1750, supplier: 'Aldersby Motor Factors' },
  { key: 'cf-410', partNumber: 'CF-410', description: 'Cabin filter, carbon', kind: 'cabin_filter', unit: '{each}', costMinor: 750, priceMinor: 1650, supplier: 'Aldersby Motor Factors' },
  { key: 'ff-512', partNumber: 'FF-512', description: 'Diesel fuel filter', kind: 'fuel_filter', unit: '{each}', costMinor: 1320, priceMinor: 2600, supplier: 'Aldersby Motor Factors' },
  { key: 'sp-14f', partNumber: 'SP-14F-07', description: 'Spark plug M14, flat seat, 16 mm hex', kind: 'spark_plug', unit: '{each}', costMinor: 390, priceMinor: 850, supplier: 'Quillon Ignition' },
  { key: 'sp-12f', partNumber: 'SP-12F-09', description: 'Spark plug M12, flat seat, 14 mm hex', kind: 'spark_plug', unit: '{each}', costMinor: 520, priceMinor: 1100, supplier: 'Quillon Ignition' },
  { key: 'wb-600', partNumber: 'WB-600', description: 'Wiper blade 600 mm', kind: 'wiper', unit: '{each}', costMinor: 610, priceMinor: 1400, supplier: 'Aldersby Motor Factors' },
  { key: 'bulb-h7', partNumber: 'BLB-H7', description: 'Headlamp bulb H7 12 V 55 W', kind: 'bulb', unit: '{each}', costMinor: 290, priceMinor: 750, supplier: 'Aldersby Motor Factors' },
  { key: 'sundries', partNumber: 'SUN-KIT', description: 'Sump washer, cable ties, cleaner', kind: 'sundries', unit: '{each}', costMinor: 120, priceMinor: 350, supplier: 'Aldersby Motor Factors' },
];

export const CUSTOMERS = [
  { key: 'c01', name: 'Harriet Quill', email: 'harriet.quill@mail.example', phone: '07700 900101', addressLines: '14 Sedgewick Row, Aldersby', postcode: 'QX1 4HR' },
  { key: 'c02', name: 'Owen Baptiste', email: 'owen.b@mail.example', phone: '07700 900102', addressLines: '3 Larch Close, Aldersby', postcode: 'QX2 7LC' },
  { key: 'c03', name: 'Sunita Rawle', email: 'sunita.rawle@mail.example', phone: '07700 900103', addressLines: 'Flat 2, 88 Ferry Lane, Aldersby', postcode: 'QX1 2FL' },
  { key: 'c04', name: 'Gideon Marsh', email: 'g.marsh@mail.example', phone: '07700 900104', addressLines: 'Marsh Farm, Coldharbour Road, Little Wenning', postcode: 'QX7 1CR' },
  { key: 'c05', name: 'Aldersby Veterinary Practice', email: 'fleet@aldersbyvets.example', phone: '01632 960 552', addressLines: '21 Market Street, Aldersby (staff car park at rear)', postcode: 'QX1 1MS' },
  { key: 'c06', name: 'Beatrix Olumide', email: 'bea.olumide@mail.example', phone: '07700 900106', addressLines: '57 Cinder Hill, Aldersby', postcode: 'QX3 5CH' },
  { key: 'c07', name: 'Callum Strand', email: 'callum.strand@mail.example', phone: '07700 900107', addressLines: '9 The Paddocks, Wenning Cross', postcode: 'QX6 2TP' },
  { key: 'c08', name: 'Delphine Arrow', email: 'delphine.arrow@mail.example', phone: '07700 900108', addressLines: '112 Quarry Road, Aldersby', postcode: 'QX2 9QR' },
  { key: 'c09', name: 'Ezra Hollings', email: 'ezra.h@mail.example', phone: '07700 900109', addressLines: '6 Kiln Cottages, Bramwell', postcode: 'QX8 3KC' },
  { key: 'c10', name: 'Fenna de Wit', email: 'fenna.dewit@mail.example', phone: '07700 900110', addressLines: '30 Orchard Way, Aldersby', postcode: 'QX3 8OW' },
  { key: 'c11', name: 'Grant Okonjo', email: 'grant.okonjo@mail.example', phone: '07700 900111', addressLines: 'Aldersby Business Park, Unit 12 car park', postcode: 'QX4 6BP' },
  { key: 'c12', name: 'Imogen Tey', email: 'imogen.tey@mail.example', phone: '07700 900112', addressLines: '2 Mill Race, Bramwell', postcode: 'QX8 1MR' },
];

type VehicleSeed = {
  key: string;
  customer: string;
  registration: string;
  vin?: string;
  make: string;
  model: string;
  engine: string;
  fuel: 'petrol' | 'diesel' | 'hybrid';
  year: number;
  oilGrade: string;
  oilCapacityL: number;
  oilFilter: string;
  airFilter: string;
  cabinFilter: string;
  fuelFilter?: string;
  sparkPlug?: string;
  sparkPlugCount?: number;
  plugThread?: string;
  plugSeat?: 'flat' | 'taper';
  plugGapMm?: number;
  plugTorqueNm?: number;
  sumpPlugTorqueNm: number;
  wheelNutTorqueNm: number;
  brakeFluidGrade: 'DOT 4' | 'DOT 5.1';
  tyrePressureFrontKpa: number;
  tyrePressureRearKpa: number;
  specialTools: string[];
  serviceIntervalMonths: number;
  serviceIntervalDistance: number;
  lastServiceMonthsAgo: number;
  lastServiceOdometer: number;
};

// Specs are invented but plausible for small petrol and diesel engines.
const corvanePippet = {
  make: 'Corvane', model: 'Pippet', engine: '1.2 petrol', fuel: 'petrol' as const,
  oilGrade: '0W-20', oilCapacityL: 3.2, oilFilter: 'of-118', airFilter: 'af-331', cabinFilter: 'cf-410',
  sparkPlug: 'sp-12f', sparkPlugCount: 3, plugThread: 'M12', plugSeat: 'flat' as const, plugGapMm: 0.9, plugTorqueNm: 18,
  sumpPlugTorqueNm: 30, wheelNutTorqueNm: 100, brakeFluidGrade: 'DOT 4' as const,
  tyrePressureFrontKpa: 230, tyrePressureRearKpa: 220, specialTools: ['14 mm bi-hex plug socket'],
  serviceIntervalMonths: 12, serviceIntervalDistance: 10000,
};
const haldenRook = {
  make: 'Halden', model: 'Rook', engine: '1.6 diesel', fuel: 'diesel' as const,
  oilGrade: '5W-30', oilCapacityL: 4.8, oilFilter: 'of-204', airFilter: 'af-352', cabinFilter: 'cf-410', fuelFilter: 'ff-512',
  sumpPlugTorqueNm: 35, wheelNutTorqueNm: 120, brakeFluidGrade: 'DOT 4' as const,
  tyrePressureFrontKpa: 250, tyrePressureRearKpa: 240, specialTools: ['8 mm hex key for the sump plug', 'Cartridge filter housing socket, 27 mm'],
  serviceIntervalMonths: 12, serviceIntervalDistance: 12000,
};
const mirakuIone = {
  make: 'Miraku', model: 'Ione', engine: '1.8 petrol hybrid', fuel: 'hybrid' as const,
  oilGrade: '0W-20', oilCapacityL: 4.2, oilFilter: 'of-118', airFilter: 'af-331', cabinFilter: 'cf-410',
  sparkPlug: 'sp-14f', sparkPlugCount: 4, plugThread: 'M14', plugSeat: 'flat' as const, plugGapMm: 1.0, plugTorqueNm: 27,
  sumpPlugTorqueNm: 38, wheelNutTorqueNm: 103, brakeFluidGrade: 'DOT 4' as const,
  tyrePressureFrontKpa: 240, tyrePressureRearKpa: 230, specialTools: ['Hybrid system: service mode before the engine runs'],
  serviceIntervalMonths: 12, serviceIntervalDistance: 10000,
};
const tolvekOrla = {
  make: 'Tolvek', model: 'Orla Van', engine: '2.0 diesel', fuel: 'diesel' as const,
  oilGrade: '5W-40', oilCapacityL: 6.1, oilFilter: 'of-204', airFilter: 'af-352', cabinFilter: 'cf-410', fuelFilter: 'ff-512',
  sumpPlugTorqueNm: 45, wheelNutTorqueNm: 160, brakeFluidGrade: 'DOT 4' as const,
  tyrePressureFrontKpa: 330, tyrePressureRearKpa: 360, specialTools: ['Oil filter housing cap wrench, 36 mm'],
  serviceIntervalMonths: 12, serviceIntervalDistance: 15000,
};
const corvaneSable = {
  make: 'Corvane', model: 'Sable', engine: '1.5 petrol turbo', fuel: 'petrol' as const,
  oilGrade: '5W-30', oilCapacityL: 4.0, oilFilter: 'of-118', airFilter: 'af-352', cabinFilter: 'cf-410',
  sparkPlug: 'sp-14f', sparkPlugCount: 4, plugThread: 'M14', plugSeat: 'flat' as const, plugGapMm: 0.7, plugTorqueNm: 25,
  sumpPlugTorqueNm: 30, wheelNutTorqueNm: 110, brakeFluidGrade: 'DOT 5.1' as const,
  tyrePressureFrontKpa: 240, tyrePressureRearKpa: 230, specialTools: [],
  serviceIntervalMonths: 12, serviceIntervalDistance: 10000,
};

export const VEHICLES: VehicleSeed[] = [
  { key: 'v01', customer: 'c01', registration: 'QK19 FEN', vin: 'XFNAH52B7KM104211', year: 2019, ...corvanePippet, lastServiceMonthsAgo: 11, lastServiceOdometer: 31200 },
  { key: 'v02', customer: 'c02', registration: 'QD68 RWL', year: 2018, ...haldenRook, lastServiceMonthsAgo: 13, lastServiceOdometer: 58840 },
  { key: 'v03', customer: 'c03', registration: 'QN21 KTE', vin: 'XMKNE18H3MN220734', year: 2021, ...mirakuIone, lastServiceMonthsAgo: 6, lastServiceOdometer: 18730 },
  { key: 'v04', customer: 'c04', registration: 'QV17 MSH', year: 2017, ...tolvekOrla, lastServiceMonthsAgo: 12, lastServiceOdometer: 101450 },
  { key: 'v05', customer: 'c05', registration: 'QL20 VET', year: 2020, ...tolvekOrla, lastServiceMonthsAgo: 10, lastServiceOdometer: 64010 },
  { key: 'v06', customer: 'c05', registration: 'QB70 VET', year: 2020, ...corvaneSable, lastServiceMonthsAgo: 11, lastServiceOdometer: 27560 },
  { key: 'v07', customer: 'c06', registration: 'QH16 OLU', year: 2016, ...corvanePippet, lastServiceMonthsAgo: 14, lastServiceOdometer: 70300 },
  { key: 'v08', customer: 'c07', registration: 'QE22 STR', year: 2022, ...mirakuIone, lastServiceMonthsAgo: 11, lastServiceOdometer: 14980 },
  { key: 'v09', customer: 'c08', registration: 'QP15 ARW', year: 2015, ...haldenRook, lastServiceMonthsAgo: 12, lastServiceOdometer: 96120 },
  { key: 'v10', customer: 'c09', registration: 'QC18 HOL', year: 2018, ...corvaneSable, lastServiceMonthsAgo: 5, lastServiceOdometer: 44700 },
  { key: 'v11', customer: 'c10', registration: 'QW69 DWT', year: 2019, ...corvanePippet, lastServiceMonthsAgo: 12, lastServiceOdometer: 22110 },
  { key: 'v12', customer: 'c11', registration: 'QR23 OKJ', year: 2023, ...tolvekOrla, lastServiceMonthsAgo: 11, lastServiceOdometer: 29930 },
  { key: 'v13', customer: 'c12', registration: 'QT14 TEY', year: 2014, ...haldenRook, lastServiceMonthsAgo: 7, lastServiceOdometer: 121400 },
];

export const MODEL_NOTES = [
  {
    key: 'mn-rook-breather',
    make: 'Halden', model: 'Rook', engine: '1.6 diesel',
    title: 'Crankcase breather hose splits at the elbow',
    body: 'The rubber elbow behind the inlet manifold hardens and splits; look for oil mist on the gearbox bell housing. Squeeze it: if it crackles, advise a new one.',
  },
  {
    key: 'mn-pippet-drains',
    make: 'Corvane', model: 'Pippet', engine: '',
    title: 'Scuttle drains block with leaves',
    body: 'Two drains under the scuttle panel, one each side. When blocked, water reaches the cabin filter housing and the passenger footwell. Clear them at every visit in autumn.',
  },
  {
    key: 'mn-ione-service-mode',
    make: 'Miraku', model: 'Ione', engine: '1.8 petrol hybrid',
    title: 'Engine will not run at idle without service mode',
    body: 'The petrol engine stops when the battery is charged. Enter service mode (see the vehicle maker’s procedure) before checking for leaks or charging voltage with the engine running.',
  },
  {
    key: 'mn-orla-filter-cap',
    make: 'Tolvek', model: 'Orla Van', engine: '',
    title: 'Oil filter cap cracks if over-tightened',
    body: 'The plastic housing cap is marked with its torque on top. Use the cap wrench and a torque wrench, never a strap wrench. Replace the O-ring every time.',
  },
];

export const CHECKLIST_FOR_VEHICLE: Record<string, 'annual' | 'interim'> = {
  v01: 'annual', v02: 'annual', v03: 'interim', v04: 'annual', v05: 'annual', v06: 'annual',
  v07: 'annual', v08: 'annual', v09: 'annual', v10: 'interim', v11: 'annual', v12: 'annual', v13: 'interim',
};

// The van side of the demo. Each oil is bought in 1 L and 5 L containers; both vans were loaded
// from the store before the week began, and the parts fitted since came off those levels.
export const OIL_CONTAINER_SIZES_L: Record<string, number[]> = {
  'oil-0w20': [1, 5],
  'oil-5w30': [1, 5],
  'oil-5w40': [1, 5],
};

export const VAN_OPENING_STOCK: Record<'tech-tom' | 'tech-jess', Record<string, number>> = {
  'tech-tom': {
    'oil-0w20': 15, 'oil-5w30': 10, 'oil-5w40': 5, 'of-118': 4, 'of-204': 2, 'af-331': 2, 'af-352': 2,
    'cf-410': 4, 'ff-512': 1, 'sp-12f': 6, 'sp-14f': 8, 'wb-600': 2, 'bulb-h7': 4, sundries: 10,
  },
  'tech-jess': {
    'oil-0w20': 10, 'oil-5w30': 15, 'oil-5w40': 10, 'of-118': 3, 'of-204': 4, 'af-331': 1, 'af-352': 3,
    'cf-410': 3, 'ff-512': 3, 'sp-12f': 3, 'sp-14f': 4, 'wb-600': 2, 'bulb-h7': 4, sundries: 10,
  },
};

// The level below which the office wants a van restocked: about one day's round.
export const VAN_MINIMUMS: Record<string, number> = {
  'oil-0w20': 5, 'oil-5w30': 5, 'oil-5w40': 5, 'of-118': 2, 'of-204': 2, 'af-331': 1, 'af-352': 1,
  'cf-410': 2, 'ff-512': 1, 'sp-12f': 3, 'sp-14f': 4, sundries: 4,
};

// Tom emptied his used-oil drum at the (invented) licensed site after his round two days back.
export const USED_OIL_DISPOSALS = [
  {
    key: 'tom-week',
    tech: 'tech-tom' as const,
    day: -2,
    time: '17:30',
    siteName: 'Aldersby Trade Waste Centre, Gasworks Lane',
    siteLicence: 'QX-WML-0417',
    reference: 'WTN-2207',
    litres: 7.5,
  },
];
