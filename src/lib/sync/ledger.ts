// Everything the merge rules need to know about one visit, held in memory: the standing value of
// each thing, the visit's lock state, its checklist items, and the history of operations on it.
// The server loads a ledger per visit, applies a batch to it and writes back what changed; the
// fuzz harness and the tests keep ledgers as their whole "database".
import type {
  StandingCheck,
  StandingFinding,
  StandingNote,
  StandingPartLine,
  StandingPhoto,
  StandingReading,
} from './standing';
import type { HistoryEntry } from './history';
import type { VisitLockState } from './merge-sign-off';

export type ItemKind = 'check' | 'reading' | 'part';

export type Ledger = VisitLockState & {
  visitId: string;
  /** The items of the visit's checklist version, by id. */
  items: ReadonlyMap<string, ItemKind>;
  checks: Map<string, StandingCheck>;
  readings: Map<string, StandingReading>;
  findings: Map<string, StandingFinding>;
  notes: Map<string, StandingNote>;
  photos: Map<string, StandingPhoto>;
  partLines: Map<string, StandingPartLine>;
  history: Map<string, HistoryEntry[]>;
  /** Things changed since the ledger was loaded: "kind:entityId", plus "visit" for the visit row. */
  dirty: Set<string>;
};

export function emptyLedger(visitId: string, items: ReadonlyMap<string, ItemKind>, status: VisitLockState['status'] = 'booked'): Ledger {
  return {
    visitId,
    status,
    liveSignOff: null,
    items,
    checks: new Map(),
    readings: new Map(),
    findings: new Map(),
    notes: new Map(),
    photos: new Map(),
    partLines: new Map(),
    history: new Map(),
    dirty: new Set(),
  };
}

/** Photos share one id space for add and remove; everything else is keyed by its own kind. */
export function historyKey(kind: string, entityId: string): string {
  return `${kind.startsWith('photo.') ? 'photo' : kind}:${entityId}`;
}

export function historyOf(ledger: Ledger, kind: string, entityId: string): HistoryEntry[] {
  return ledger.history.get(historyKey(kind, entityId)) ?? [];
}

export function remember(ledger: Ledger, entry: HistoryEntry): void {
  const key = historyKey(entry.kind, entry.entityId);
  const list = ledger.history.get(key);
  if (list) list.push(entry);
  else ledger.history.set(key, [entry]);
}
