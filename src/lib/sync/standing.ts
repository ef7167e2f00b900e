// What stands for each thing on a visit, as the merge rules see it. Three sides must never be
// mixed up (Excalidraw keeps remote and local elements apart the same way):
//   Standing<T>  the value the server holds (or, on the device, the value a pull brought);
//   Local<T>     the device's own view, which may include changes still in its outbox;
//   Operation    a proposed change (operations.ts), never a state.
// The brands exist only for the type checker; at run time these are plain objects.
import type { Stamp } from './clock';
import type { CHECK_STATES, Severity } from './operations';
import type { SeverityLog } from './severity-log';

declare const held: unique symbol;
export type Standing<T> = T & { readonly [held]: 'standing' };
export type Local<T> = T & { readonly [held]: 'local' };

/** Marks a value as the one the server holds (after loading it, or after a merge produced it). */
export function asStanding<T extends object>(value: T): Standing<T> {
  return value as Standing<T>;
}

/** Marks a value as the device's own view. */
export function asLocal<T extends object>(value: T): Local<T> {
  return value as Local<T>;
}

/** Who last set a value, where the server knows (pulled rows do not say). */
type Provenance = { opId: string | null; author: string | null };

export type CheckValue = { state: (typeof CHECK_STATES)[number]; stamp: Stamp } & Provenance;

export type ReadingValue = {
  value: number | null;
  textValue: string | null;
  unit: string | null;
  stamp: Stamp;
} & Provenance;

export type FindingValue = {
  itemId: string | null;
  title: string;
  detail: string;
  // Stamp of the latest change to title, detail and item (later stamp wins).
  stamp: Stamp;
  severity: Severity;
  severityStamp: Stamp;
  severityLog: SeverityLog;
  author: string | null;
};

export type NoteValue = { body: string; stamp: Stamp; author: string | null };

export type PhotoValue = {
  findingId: string | null;
  itemId: string | null;
  caption: string;
  sha256: string;
  contentType: string;
  sizeBytes: number;
  width: number | null;
  height: number | null;
  addStamp: Stamp;
  // Set only by a remove that had seen the latest add.
  removedStamp: Stamp | null;
  author: string | null;
};

export type PartLineValue = {
  itemId: string | null;
  partId: string | null;
  partNumber: string;
  description: string;
  quantity: number;
  unit: string;
  removed: boolean;
  stamp: Stamp;
} & Provenance;

export type SignOffValue = {
  id: string;
  odometer: number;
  odometerUnit: 'km' | '[mi_i]';
  customerName: string;
  signatureSvg: string;
  declaration: string;
  technicianId: string;
  signedAt: string;
  stamp: Stamp;
  opId: string | null;
};

export type StandingCheck = Standing<CheckValue>;
export type StandingReading = Standing<ReadingValue>;
export type StandingFinding = Standing<FindingValue>;
export type StandingNote = Standing<NoteValue>;
export type StandingPhoto = Standing<PhotoValue>;
export type StandingPartLine = Standing<PartLineValue>;
export type StandingSignOff = Standing<SignOffValue>;
