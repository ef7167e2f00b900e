// The common shape of every merge rule: the standing value (or none), an incoming operation,
// and what came of it.
import { compareStamps, type Stamp } from './clock';
import type { OperationKind, OperationOf } from './operations';

/** An operation as the merge rules take it: with the stamp it merges with (see stamp-bound). */
export type Incoming<K extends OperationKind> = {
  op: OperationOf<K>;
  stamp: Stamp;
  author: string;
  /** Office and owner may lower a finding's severity, by saying so (payload.downgrade). */
  mayDowngrade: boolean;
};

/** One side of a conflict as the office will see it. */
export type ConflictSide = {
  value: Record<string, unknown>;
  stamp: Stamp;
  opId: string | null;
  author: string | null;
};

export type ConflictDraft = {
  kind: OperationKind;
  entityId: string;
  /** The value that did not win, or could not be applied. */
  proposed: ConflictSide;
  /** The value that stands. */
  standing: ConflictSide | null;
};

export type MergeOutcome = 'applied' | 'superseded' | 'conflict';

export type Merged<S> = {
  outcome: MergeOutcome;
  /** The new standing value, or null when it does not change. */
  next: S | null;
  conflicts: ConflictDraft[];
  reason?: string;
};

export const isLater = (a: Stamp, b: Stamp) => compareStamps(a, b) > 0;

export function unchanged<S>(outcome: MergeOutcome, reason?: string, conflicts: ConflictDraft[] = []): Merged<S> {
  return reason === undefined ? { outcome, next: null, conflicts } : { outcome, next: null, conflicts, reason };
}
