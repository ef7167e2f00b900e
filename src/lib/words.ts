// The enumerations of PRODUCT.md's vocabulary, in one place that the Drizzle schema, the server
// and the browser islands all import (the schema re-exports them). Plain arrays only: an island
// that needs the list of fuel types must not pull the database layer into its bundle.

export const USER_ROLES = ['owner', 'office', 'technician'] as const;
export const DISTANCE_UNITS = ['km', '[mi_i]'] as const;

export const PART_KINDS = [
  'oil',
  'oil_filter',
  'air_filter',
  'cabin_filter',
  'fuel_filter',
  'spark_plug',
  'wiper',
  'bulb',
  'grease',
  'sundries',
] as const;
// UCUM codes: litres for bulk fluids, {each} (an annotation of unity) for counted parts.
export const PART_UNITS = ['L', '{each}'] as const;

export const FUEL_TYPES = ['petrol', 'diesel', 'hybrid', 'electric', 'lpg'] as const;
export const PLUG_SEATS = ['flat', 'taper'] as const;
export const BRAKE_FLUID_GRADES = ['DOT 3', 'DOT 4', 'DOT 5', 'DOT 5.1'] as const;

export const ITEM_KINDS = ['check', 'reading', 'part'] as const;
export const TEMPLATE_VERSION_STATUSES = ['draft', 'published', 'retired'] as const;

export const VISIT_STATUSES = [
  'booked',
  'in_progress',
  'signed_off',
  'reviewed',
  'invoiced',
  'paid',
  'cancelled',
] as const;

export type UserRole = (typeof USER_ROLES)[number];
export type VisitStatus = (typeof VISIT_STATUSES)[number];
export type DistanceUnit = (typeof DISTANCE_UNITS)[number];

/** What a sync operation is, in the office's words (conflicts, imports). */
export const OPERATION_KIND_WORDS: Record<string, string> = {
  check: 'check',
  reading: 'reading',
  finding: 'finding',
  note: 'note',
  'photo.add': 'photo',
  'photo.remove': 'photo removal',
  part_line: 'part line',
  sign_off: 'sign-off',
};
