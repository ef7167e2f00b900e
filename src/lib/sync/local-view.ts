// The device's view of a visit: what the last pull brought (the server's standing values), with
// the operations still in the outbox merged on top by the same rules the server will apply. So
// the phone shows now what the server will hold once the outbox drains, and a pulled value never
// hides a change the technician has made but not yet pushed.
//
// A pulled value replaces the device's copy whenever no outbox operation touches that thing: the
// server is the source of truth for what everyone sees (PRODUCT.md). Comparing a pulled stamp
// with a local one instead would keep a wrong local value for ever when the server bounded the
// stamp of a phone whose clock ran ahead (stamp-bound.ts).
import { isStamp, type Stamp } from './clock';
import type { Operation } from './operations';
import type { z } from 'zod';
import type {
  pulledCheckResult,
  pulledFinding,
  pulledNote,
  pulledPartLine,
  pulledPhoto,
  pulledReadingResult,
  pulledSignOff,
} from './pull';
import { applyOperation } from './apply-operation';
import { emptyLedger, type ItemKind, type Ledger } from './ledger';
import { logOfSingleEvent, type SeverityLog } from './severity-log';
import { asStanding, type Local } from './standing';
import type { VisitLockState } from './merge-sign-off';

export type PulledVisitRecords = {
  checkResults: z.infer<typeof pulledCheckResult>[];
  readingResults: z.infer<typeof pulledReadingResult>[];
  findings: (z.infer<typeof pulledFinding> & { severityLog?: SeverityLog | null })[];
  notes: z.infer<typeof pulledNote>[];
  photos: z.infer<typeof pulledPhoto>[];
  partLines: z.infer<typeof pulledPartLine>[];
  signOffs: z.infer<typeof pulledSignOff>[];
};

const stampOf = (s: string): Stamp => {
  if (!isStamp(s)) throw new Error(`pulled stamp "${s}" is not a clock stamp`);
  return s;
};

/** A ledger holding exactly what the server sent for one visit. */
export function ledgerFromPull(
  visitId: string,
  status: VisitLockState['status'],
  items: ReadonlyMap<string, ItemKind>,
  rows: PulledVisitRecords,
): Ledger {
  const ledger = emptyLedger(visitId, items, status);
  const mine = <T extends { visitId: string }>(list: T[]) => list.filter((r) => r.visitId === visitId);
  for (const r of mine(rows.checkResults)) {
    ledger.checks.set(r.itemId, asStanding({ state: r.state, stamp: stampOf(r.stamp), opId: null, author: null }));
  }
  for (const r of mine(rows.readingResults)) {
    ledger.readings.set(r.itemId, asStanding({ value: r.value, textValue: r.textValue, unit: r.unit, stamp: stampOf(r.stamp), opId: null, author: null }));
  }
  for (const f of mine(rows.findings)) {
    const severityStamp = stampOf(f.severityStamp);
    ledger.findings.set(
      f.id,
      asStanding({
        itemId: f.itemId,
        title: f.title,
        detail: f.detail,
        stamp: stampOf(f.stamp),
        severity: f.severity,
        severityStamp,
        severityLog: f.severityLog ?? logOfSingleEvent({ stamp: severityStamp, severity: f.severity, opId: null }),
        author: null,
      }),
    );
  }
  for (const n of mine(rows.notes)) ledger.notes.set(n.id, asStanding({ body: n.body, stamp: stampOf(n.stamp), author: n.authorId }));
  for (const p of mine(rows.photos)) {
    const addStamp = stampOf(p.addStamp);
    ledger.photos.set(
      p.id,
      asStanding({
        findingId: p.findingId,
        itemId: p.itemId,
        caption: p.caption,
        sha256: p.sha256,
        contentType: p.contentType,
        sizeBytes: 1,
        width: null,
        height: null,
        addStamp,
        // The pull says only whether it is removed; any remove stamp at or after the add will do.
        removedStamp: p.removed ? addStamp : null,
        author: null,
      }),
    );
  }
  for (const l of mine(rows.partLines)) {
    const { id: _id, visitId: _v, stamp, ...line } = l;
    ledger.partLines.set(l.id, asStanding({ ...line, stamp: stampOf(stamp), opId: null, author: null }));
  }
  const live = mine(rows.signOffs).find((s) => !s.voided);
  if (live) {
    const { visitId: _v, voided: _voided, stamp, ...s } = live;
    ledger.liveSignOff = asStanding({ ...s, stamp: stampOf(stamp), opId: null });
  }
  return ledger;
}

export type DeviceUser = { userId: string; role: 'technician' | 'office' | 'owner' };

/** The pulled ledger with the outbox's operations (oldest first) merged on top. */
export function localView(pulled: Ledger, pending: readonly Operation[], user: DeviceUser): Local<Ledger> {
  const view = structuredClone(pulled);
  for (const op of pending) {
    if (op.visitId !== view.visitId) continue;
    applyOperation(view, { op, stamp: op.stamp, author: user.userId, mayDowngrade: user.role !== 'technician' });
  }
  view.dirty.clear();
  return view as Local<Ledger>;
}
