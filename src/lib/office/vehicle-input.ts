// What the office types about a vehicle and its service spec. Quantities arrive in SI (L, mm,
// N.m, kPa): the form converts from whatever unit was typed before it sends. Trade checks (VIN,
// registration, oil grade) come from lib/trade so the phone and the office judge alike.
import { z } from 'zod';
import { BRAKE_FLUID_GRADES, DISTANCE_UNITS, FUEL_TYPES, PLUG_SEATS } from '../words';
import { optionalNumber, optionalText } from './form-values';
import { registrationField, vinField, oilGradeField } from './trade-fields';

const partId = z
  .union([z.uuid(), z.literal(''), z.null()])
  .transform((value) => (value === '' ? null : value));

export const vehicleInput = z.object({
  customerId: z.uuid('choose the customer'),
  registration: registrationField,
  vin: vinField,
  make: z.string().trim().min(1, 'needs a make').max(60),
  model: z.string().trim().min(1, 'needs a model').max(60),
  engine: z.string().trim().max(60),
  fuel: z.enum(FUEL_TYPES),
  year: optionalNumber({ min: 1900, max: 2100, integer: true }),
  odometerUnit: z.enum(DISTANCE_UNITS),
  oilGrade: oilGradeField,
  // Bounds mirror the database checks (vehicles_oil_capacity_check, vehicles_plug_gap_check).
  oilCapacityL: optionalNumber({ min: 0.5, max: 49 }),
  oilFilterPartId: partId,
  airFilterPartId: partId,
  cabinFilterPartId: partId,
  fuelFilterPartId: partId,
  sparkPlugPartId: partId,
  sparkPlugCount: optionalNumber({ min: 1, max: 16, integer: true }),
  plugThread: optionalText(12),
  plugSeat: z
    .union([z.enum(PLUG_SEATS), z.literal(''), z.null()])
    .transform((value) => (value === '' ? null : value)),
  plugGapMm: optionalNumber({ min: 0.1, max: 2.9 }),
  plugTorqueNm: optionalNumber({ min: 1, max: 200 }),
  sumpPlugTorqueNm: optionalNumber({ min: 1, max: 300 }),
  wheelNutTorqueNm: optionalNumber({ min: 20, max: 1000 }),
  brakeFluidGrade: z
    .union([z.enum(BRAKE_FLUID_GRADES), z.literal(''), z.null()])
    .transform((value) => (value === '' ? null : value)),
  tyrePressureFrontKpa: optionalNumber({ min: 50, max: 1200 }),
  tyrePressureRearKpa: optionalNumber({ min: 50, max: 1200 }),
  // One tool a line in the form; a list in the database.
  specialTools: z
    .union([z.string().transform((text) => text.split('\n')), z.array(z.string())])
    .transform((tools) => tools.map((t) => t.trim()).filter((t) => t !== ''))
    .pipe(z.array(z.string().max(120, 'a tool is at most 120 characters')).max(20, 'at most 20 special tools')),
  serviceIntervalMonths: optionalNumber({ min: 1, max: 120, integer: true }),
  serviceIntervalDistance: optionalNumber({ min: 100, max: 200_000, integer: true }),
  lastServiceDate: z
    .union([z.iso.date('use a date such as 2026-03-14'), z.literal(''), z.null()])
    .transform((value) => (value === '' ? null : value)),
  lastServiceOdometer: optionalNumber({ min: 0, max: 5_000_000, integer: true }),
});

export type VehicleInput = z.output<typeof vehicleInput>;
export type VehicleFormValues = z.input<typeof vehicleInput>;

export const VEHICLE_SORTS = ['registration', 'make', 'customer', 'year', 'lastService'] as const;
