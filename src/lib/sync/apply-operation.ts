// Applies one operation to a visit's ledger: the visit-level rules (locks, status) around the
// per-kind merge rules. Deterministic and free of I/O; the caller persists what became dirty.
import { entityIdOf, type Operation, type OperationKind, type Outcome } from './operations';
import type { ConflictDraft, Incoming, Merged } from './merge-result';
import { historyOf, remember, type Ledger } from './ledger';
import { mergeCheck } from './merge-check';
import { mergeReading } from './merge-reading';
import { mergeFinding } from './merge-finding';
import { mergeNote } from './merge-note';
import { mergePhotoAdd, mergePhotoRemove } from './merge-photo';
import { mergePartLine } from './merge-part-line';
import { lockOf, signOffFrom } from './merge-sign-off';

export const CONFLICT_REASONS = ['concurrent_edit', 'visit_locked', 'visit_cancelled', 'visit_reassigned'] as const;
export type ConflictReason = (typeof CONFLICT_REASONS)[number];

export type RecordedConflict = ConflictDraft & { reason: ConflictReason };

export type Applied = {
  outcome: Exclude<Outcome, 'duplicate'>;
  reason?: string;
  conflicts: RecordedConflict[];
};

/** Whether the operation fits the visit's checklist; a reason when it does not. */
export function invalidForVisit(ledger: Ledger, op: Operation): string | null {
  const itemOfKind = (itemId: string | null, kind: 'check' | 'reading' | 'part' | 'any') => {
    if (itemId === null) return null;
    const found = ledger.items.get(itemId);
    if (!found) return `item ${itemId} is not on this visit's checklist`;
    if (kind !== 'any' && found !== kind) return `item ${itemId} is a ${found} item, not a ${kind} item`;
    return null;
  };
  switch (op.kind) {
    case 'check':
      return itemOfKind(op.payload.itemId, 'check');
    case 'reading':
      return itemOfKind(op.payload.itemId, 'reading');
    case 'finding':
      return itemOfKind(op.payload.itemId, 'any');
    case 'part_line':
      return itemOfKind(op.payload.itemId, 'part');
    case 'photo.add':
      return itemOfKind(op.payload.itemId, 'any');
    default:
      return null;
  }
}

export function applyOperation(ledger: Ledger, incoming: Incoming<OperationKind>): Applied {
  const { op } = incoming;
  const entityId = entityIdOf(op);
  const result = decide(ledger, incoming, entityId);
  remember(ledger, { opId: op.opId, kind: op.kind, entityId, stamp: incoming.stamp, seenStamp: op.seenStamp, deviceId: op.deviceId });
  if (result.outcome === 'applied' && ledger.status === 'booked') {
    // The first change recorded on a booked visit means the technician has started it.
    ledger.status = 'in_progress';
    ledger.dirty.add('visit');
  }
  return result;
}

function decide(ledger: Ledger, incoming: Incoming<OperationKind>, entityId: string): Applied {
  const { op } = incoming;
  const lock = lockOf(ledger);
  if (lock) {
    if (op.kind === 'sign_off' && ledger.liveSignOff?.id === op.payload.signOffId) {
      return { outcome: 'superseded', reason: 'this sign-off is already recorded', conflicts: [] };
    }
    const proposed = { value: { ...op.payload }, stamp: incoming.stamp, opId: op.opId, author: incoming.author };
    return { outcome: 'locked', reason: lock.message, conflicts: [{ kind: op.kind, entityId, reason: lock.reason, proposed, standing: null }] };
  }
  switch (op.kind) {
    case 'check':
      return settle(ledger, 'check', entityId, ledger.checks, mergeCheck(ledger.checks.get(entityId) ?? null, as(incoming, op)));
    case 'reading': {
      const merged = mergeReading(ledger.readings.get(entityId) ?? null, as(incoming, op), historyOf(ledger, 'reading', entityId));
      return settle(ledger, 'reading', entityId, ledger.readings, merged);
    }
    case 'finding':
      return settle(ledger, 'finding', entityId, ledger.findings, mergeFinding(ledger.findings.get(entityId) ?? null, as(incoming, op)));
    case 'note':
      return settle(ledger, 'note', entityId, ledger.notes, mergeNote(ledger.notes.get(entityId) ?? null, as(incoming, op)));
    case 'photo.add': {
      const merged = mergePhotoAdd(ledger.photos.get(entityId) ?? null, as(incoming, op), historyOf(ledger, 'photo.add', entityId));
      return settle(ledger, 'photo', entityId, ledger.photos, merged);
    }
    case 'photo.remove':
      return settle(ledger, 'photo', entityId, ledger.photos, mergePhotoRemove(ledger.photos.get(entityId) ?? null, as(incoming, op)));
    case 'part_line':
      return settle(ledger, 'part_line', entityId, ledger.partLines, mergePartLine(ledger.partLines.get(entityId) ?? null, as(incoming, op)));
    case 'sign_off':
      ledger.liveSignOff = signOffFrom(as(incoming, op));
      ledger.status = 'signed_off';
      ledger.dirty.add('visit');
      ledger.dirty.add(`sign_off:${ledger.liveSignOff.id}`);
      return { outcome: 'applied', conflicts: [] };
  }
}

function settle<S>(ledger: Ledger, table: string, entityId: string, map: Map<string, S>, merged: Merged<S>): Applied {
  if (merged.next) {
    map.set(entityId, merged.next);
    ledger.dirty.add(`${table}:${entityId}`);
  }
  const conflicts = merged.conflicts.map((c) => ({ ...c, reason: 'concurrent_edit' as const }));
  return merged.reason === undefined ? { outcome: merged.outcome, conflicts } : { outcome: merged.outcome, reason: merged.reason, conflicts };
}

/** Narrows an incoming operation to its kind (the switch above has already checked it). */
function as<K extends OperationKind>(incoming: Incoming<OperationKind>, op: Extract<Operation, { kind: K }>): Incoming<K> {
  return { ...incoming, op };
}
