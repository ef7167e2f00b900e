// The merge rules of PRODUCT.md written the plainest way: a function of the SET of operations
// the server recorded (each with the stamp it merged with), so it cannot depend on delivery
// order. Tests compare the server's state with it. It shares no code with the merge rules.
import type { Stamp } from '../clock';
import { SEVERITY_RANK, type Operation, type OperationOf, type Severity } from '../operations';
import type { Ledger } from '../ledger';

export type RecordedOp = { op: Operation; stamp: Stamp; mayDowngrade: boolean };

export type VisitPicture = {
  checks: Record<string, string>;
  readings: Record<string, string>;
  findings: Record<string, { title: string; detail: string; itemId: string | null; severity: Severity }>;
  notes: Record<string, string>;
  photos: Record<string, { caption: string; removed: boolean }>;
  partLines: Record<string, { partNumber: string; quantity: number; removed: boolean }>;
};

const latest = <T extends { stamp: Stamp }>(list: T[]): T => list.reduce((a, b) => (b.stamp > a.stamp ? b : a));
const readingText = (p: { value: number | null; textValue: string | null; unit: string | null }) =>
  `${p.value ?? p.textValue} ${p.unit ?? ''}`;

function byEntity<K extends Operation['kind']>(ops: RecordedOp[], kind: K, idOf: (op: OperationOf<K>) => string) {
  const groups = new Map<string, (RecordedOp & { op: OperationOf<K> })[]>();
  for (const r of ops) {
    if (r.op.kind !== kind) continue;
    const typed = r as RecordedOp & { op: OperationOf<K> };
    const id = idOf(typed.op);
    groups.set(id, [...(groups.get(id) ?? []), typed]);
  }
  return groups;
}

export function modelOf(recorded: RecordedOp[]): VisitPicture {
  const picture: VisitPicture = { checks: {}, readings: {}, findings: {}, notes: {}, photos: {}, partLines: {} };
  for (const [id, list] of byEntity(recorded, 'check', (op) => op.payload.itemId)) picture.checks[id] = latest(list).op.payload.state;
  for (const [id, list] of byEntity(recorded, 'reading', (op) => op.payload.itemId)) picture.readings[id] = readingText(latest(list).op.payload);
  for (const [id, list] of byEntity(recorded, 'finding', (op) => op.payload.findingId)) {
    const { title, detail, itemId } = latest(list).op.payload;
    const resets = list.filter((r) => r.op.payload.downgrade && r.mayDowngrade);
    const reset = resets.length ? latest(resets) : null;
    const counted = reset ? [reset, ...list.filter((r) => r.stamp > reset.stamp)] : list;
    const severity = counted.map((r) => r.op.payload.severity).reduce((a, b) => (SEVERITY_RANK[b] > SEVERITY_RANK[a] ? b : a));
    picture.findings[id] = { title, detail, itemId, severity };
  }
  for (const [id, list] of byEntity(recorded, 'note', (op) => op.payload.noteId)) picture.notes[id] = list[0]!.op.payload.body;
  const removes = byEntity(recorded, 'photo.remove', (op) => op.payload.photoId);
  for (const [id, list] of byEntity(recorded, 'photo.add', (op) => op.payload.photoId)) {
    const add = latest(list);
    const removed = (removes.get(id) ?? []).some((r) => r.op.seenStamp !== null && r.op.seenStamp >= add.stamp);
    picture.photos[id] = { caption: add.op.payload.caption, removed };
  }
  for (const [id, list] of byEntity(recorded, 'part_line', (op) => op.payload.lineId)) {
    const { partNumber, quantity, removed } = latest(list).op.payload;
    picture.partLines[id] = { partNumber, quantity, removed };
  }
  return picture;
}

/** The same picture, read from a ledger. */
export function pictureOf(ledger: Ledger): VisitPicture {
  const picture: VisitPicture = { checks: {}, readings: {}, findings: {}, notes: {}, photos: {}, partLines: {} };
  for (const [id, c] of ledger.checks) picture.checks[id] = c.state;
  for (const [id, r] of ledger.readings) picture.readings[id] = readingText(r);
  for (const [id, f] of ledger.findings) picture.findings[id] = { title: f.title, detail: f.detail, itemId: f.itemId, severity: f.severity };
  for (const [id, n] of ledger.notes) picture.notes[id] = n.body;
  for (const [id, p] of ledger.photos) picture.photos[id] = { caption: p.caption, removed: p.removedStamp !== null };
  for (const [id, l] of ledger.partLines) picture.partLines[id] = { partNumber: l.partNumber, quantity: l.quantity, removed: l.removed };
  return picture;
}

/** A picture as text with its keys sorted, so two pictures compare equal whatever the insertion order. */
export function describePicture(picture: VisitPicture): string {
  return JSON.stringify(picture, (_key, value: unknown) =>
    value && typeof value === 'object' && !Array.isArray(value)
      ? Object.fromEntries(Object.entries(value as Record<string, unknown>).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)))
      : value,
  );
}
