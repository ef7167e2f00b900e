// The merge rules of PRODUCT.md, one at a time, through the same engine the server runs.
import { randomUUID } from 'node:crypto';
import { beforeEach, describe, expect, it } from 'vitest';
import { applyOperation, invalidForVisit } from '../../../src/lib/sync/apply-operation';
import { emptyLedger, type ItemKind, type Ledger } from '../../../src/lib/sync/ledger';
import type { Operation } from '../../../src/lib/sync/operations';
import { TestDevice } from '../../support/sync-ops';

const CHECK = randomUUID();
const READING = randomUUID();
const PART = randomUUID();
const items = new Map<string, ItemKind>([
  [CHECK, 'check'],
  [READING, 'reading'],
  [PART, 'part'],
]);
const T0 = Date.UTC(2026, 2, 10, 9, 0, 0);

let ledger: Ledger;
let visitId: string;
let tara: TestDevice;
let theo: TestDevice;

function apply(op: Operation, options: { office?: boolean; author?: string } = {}) {
  return applyOperation(ledger, { op, stamp: op.stamp, author: options.author ?? op.deviceId, mayDowngrade: options.office ?? false });
}

beforeEach(() => {
  visitId = randomUUID();
  ledger = emptyLedger(visitId, items);
  tara = new TestDevice('tara-phone', T0);
  theo = new TestDevice('theo-phone', T0 + 500);
});

describe('check state: the later stamp wins', () => {
  it('takes a later change and supersedes an older one, whatever the arrival order', () => {
    const older = tara.check(visitId, CHECK, 'skipped');
    const newer = theo.check(visitId, CHECK, 'done');
    expect(apply(newer).outcome).toBe('applied');
    expect(apply(older).outcome).toBe('superseded');
    expect(ledger.checks.get(CHECK)?.state).toBe('done');
  });
});

describe('reading: the later stamp wins, a concurrent loser goes to the conflict list', () => {
  it('keeps the losing value of a concurrent edit as a conflict when it arrives late', () => {
    const taras = tara.reading(visitId, READING, 3.1);
    const theos = theo.reading(visitId, READING, 2.4);
    expect(apply(theos).outcome).toBe('applied');
    const late = apply(taras);
    expect(late.outcome).toBe('conflict');
    expect(late.conflicts).toHaveLength(1);
    expect(late.conflicts[0]).toMatchObject({ reason: 'concurrent_edit', proposed: { value: { value: 3.1 }, opId: taras.opId } });
    expect(ledger.readings.get(READING)?.value).toBe(2.4);
  });

  it('records the standing value as the loser when a concurrent edit with a later stamp arrives', () => {
    const taras = tara.reading(visitId, READING, 3.1);
    const theos = theo.reading(visitId, READING, 2.4);
    apply(taras);
    const result = apply(theos);
    expect(result.outcome).toBe('applied');
    expect(result.conflicts[0]).toMatchObject({ proposed: { value: { value: 3.1 }, opId: taras.opId }, standing: { value: { value: 2.4 } } });
  });

  it('raises no conflict when the writer had seen the standing value', () => {
    const first = tara.reading(visitId, READING, 3.1);
    apply(first);
    const correction = theo.reading(visitId, READING, 3.2, first.stamp);
    expect(apply(correction)).toMatchObject({ outcome: 'applied', conflicts: [] });
  });

  it('raises no conflict for a device correcting itself, even delivered out of order', () => {
    const first = tara.reading(visitId, READING, 31);
    const fixed = tara.reading(visitId, READING, 3.1, first.stamp);
    apply(fixed);
    expect(apply(first)).toMatchObject({ outcome: 'superseded', conflicts: [] });
    expect(ledger.readings.get(READING)?.value).toBe(3.1);
  });
});

describe('finding severity: the higher wins; only the office lowers it, explicitly', () => {
  const findingId = randomUUID();

  it('keeps the higher severity when a technician sends a lower one', () => {
    apply(tara.finding(visitId, findingId, 'soon'));
    const lower = apply(theo.finding(visitId, findingId, 'watch', { title: 'Brake hose: surface cracks only' }));
    expect(lower.outcome).toBe('applied');
    expect(lower.reason).toMatch(/stays soon/);
    const finding = ledger.findings.get(findingId)!;
    expect(finding.severity).toBe('soon');
    // Other fields: the later stamp wins.
    expect(finding.title).toBe('Brake hose: surface cracks only');
  });

  it('ignores a downgrade flag from a technician', () => {
    apply(tara.finding(visitId, findingId, 'now'));
    const result = apply(theo.finding(visitId, findingId, 'ok', { downgrade: true }));
    expect(result.reason).toMatch(/only the office/);
    expect(ledger.findings.get(findingId)?.severity).toBe('now');
  });

  it('lets the office lower it by saying so', () => {
    const raised = tara.finding(visitId, findingId, 'now');
    apply(raised);
    const office = new TestDevice('server', T0 + 3_600_000);
    apply(office.finding(visitId, findingId, 'watch', { downgrade: true, seen: raised.stamp }), { office: true });
    expect(ledger.findings.get(findingId)?.severity).toBe('watch');
  });

  it('keeps a raise the office had not seen in the conflict list, in either arrival order', () => {
    const created = tara.finding(visitId, findingId, 'watch');
    const office = new TestDevice('server', T0 + 3_600_000);
    const downgrade = office.finding(visitId, findingId, 'ok', { downgrade: true, seen: created.stamp });
    const unseenRaise = theo.finding(visitId, findingId, 'now');

    apply(created);
    apply(downgrade, { office: true });
    const late = apply(unseenRaise);
    expect(late.outcome).toBe('conflict');
    expect(ledger.findings.get(findingId)?.severity).toBe('ok');

    ledger = emptyLedger(visitId, items);
    apply(created);
    apply(unseenRaise);
    const reset = apply(downgrade, { office: true });
    expect(reset.outcome).toBe('applied');
    expect(reset.conflicts.map((c) => c.proposed.value)).toEqual([{ severity: 'now' }]);
    expect(ledger.findings.get(findingId)?.severity).toBe('ok');
  });

  it('counts a raise stamped after the downgrade', () => {
    const office = new TestDevice('server', T0);
    apply(tara.finding(visitId, findingId, 'soon'));
    apply(office.finding(visitId, findingId, 'ok', { downgrade: true }), { office: true });
    apply(theo.advance(7_200_000).finding(visitId, findingId, 'soon'));
    expect(ledger.findings.get(findingId)?.severity).toBe('soon');
  });
});

describe('notes: added, never overwritten', () => {
  it('adds each note as its own record and keeps a rewrite for the office', () => {
    const noteId = randomUUID();
    apply(tara.note(visitId, 'Customer asked about the wiper blades.', noteId));
    apply(tara.note(visitId, 'Sump plug washer renewed.'));
    const rewrite = apply(theo.note(visitId, 'Something else entirely.', noteId));
    expect(rewrite.outcome).toBe('conflict');
    expect(ledger.notes.size).toBe(2);
    expect(ledger.notes.get(noteId)?.body).toBe('Customer asked about the wiper blades.');
  });
});

describe('photos: an add wins over a remove that had not seen it', () => {
  const photoId = randomUUID();
  const sha = 'a'.repeat(64);

  it('removes a photo when the remove had seen its add', () => {
    const add = tara.photoAdd(visitId, photoId, sha);
    apply(add);
    expect(apply(theo.photoRemove(visitId, photoId, add.stamp)).outcome).toBe('applied');
    expect(ledger.photos.get(photoId)?.removedStamp).not.toBeNull();
  });

  it('keeps a re-added photo that the remove had not seen, in either order', () => {
    const add = tara.photoAdd(visitId, photoId, sha);
    const remove = theo.photoRemove(visitId, photoId, add.stamp);
    const readd = tara.photoAdd(visitId, photoId, sha, { caption: 'Worn pad, closer', seen: add.stamp });
    for (const order of [
      [add, remove, readd],
      [add, readd, remove],
      [readd, remove, add],
    ]) {
      ledger = emptyLedger(visitId, items);
      for (const op of order) apply(op);
      expect(ledger.photos.get(photoId)).toMatchObject({ removedStamp: null, caption: 'Worn pad, closer' });
    }
  });

  it('applies a remove that arrives before its add once the add arrives', () => {
    const add = tara.photoAdd(visitId, photoId, sha);
    apply(theo.photoRemove(visitId, photoId, add.stamp));
    apply(add);
    expect(ledger.photos.get(photoId)?.removedStamp).not.toBeNull();
  });
});

describe('part lines: the later stamp wins; removal is a tombstone', () => {
  it('does not bring a removed line back with an older edit', () => {
    const lineId = randomUUID();
    const edit = tara.partLine(visitId, lineId, 2);
    const removal = theo.partLine(visitId, lineId, 2, { removed: true });
    apply(removal);
    expect(apply(edit).outcome).toBe('superseded');
    expect(ledger.partLines.get(lineId)?.removed).toBe(true);
  });
});

describe('sign-off: the first wins and locks the visit', () => {
  it('locks the visit and keeps later operations in the conflict list', () => {
    apply(tara.check(visitId, CHECK, 'done'));
    expect(ledger.status).toBe('in_progress');
    const signOff = tara.signOff(visitId);
    expect(apply(signOff).outcome).toBe('applied');
    expect(ledger.status).toBe('signed_off');

    const late = apply(theo.reading(visitId, READING, 2.0));
    expect(late.outcome).toBe('locked');
    expect(late.conflicts[0]).toMatchObject({ reason: 'visit_locked', proposed: { value: { value: 2 } }, standing: null });
    expect(ledger.readings.size).toBe(0);

    expect(apply(theo.signOff(visitId)).outcome).toBe('locked');
    expect(apply({ ...signOff, opId: randomUUID() }).outcome).toBe('superseded');
  });

  it('keeps operations on a cancelled visit for the office', () => {
    ledger.status = 'cancelled';
    expect(apply(tara.check(visitId, CHECK, 'done')).conflicts[0]?.reason).toBe('visit_cancelled');
  });
});

describe('operations that do not fit the visit', () => {
  it('names the item that is not on the checklist or has another kind', () => {
    expect(invalidForVisit(ledger, tara.check(visitId, randomUUID(), 'done'))).toMatch(/not on this visit's checklist/);
    expect(invalidForVisit(ledger, tara.reading(visitId, CHECK, 1))).toMatch(/is a check item, not a reading item/);
    expect(invalidForVisit(ledger, tara.reading(visitId, READING, 1))).toBeNull();
  });
});
