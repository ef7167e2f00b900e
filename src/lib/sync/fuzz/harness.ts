// Seeded fuzzing of the sync rules (in the spirit of tldraw's sync fuzz tests): two to five
// devices with skewed clocks edit one visit offline, push in random splits over a network that
// loses requests and answers, and pull now and then. After every step the harness checks its
// invariants; at the end every device drains its outbox and pulls, and all must agree.
//
// Invariants: an operation that reached the server is recorded exactly once (idempotent); the
// server's state equals the model of the rules over the recorded operations (model.ts); a reading
// that lost without anyone having seen it is in the conflict list (lossless); replaying the
// recorded operations in another order gives the same state (convergent).
import { decodeStamp, encodeStamp, receive, tick, type Hlc, type Stamp } from '../clock';
import { CHECK_STATES, SEVERITIES, entityIdOf, type Operation } from '../operations';
import { applyOperation, type RecordedConflict } from '../apply-operation';
import { emptyLedger, historyOf, type ItemKind, type Ledger } from '../ledger';
import { localView } from '../local-view';
import { boundStamp, normaliseSeen } from '../stamp-bound';
import { seenByLater } from '../history';
import { describePicture, modelOf, pictureOf, type RecordedOp } from './model';
import { seededRandom, type Random } from './random';

const DAY_MS = 86_400_000;
const START_MS = Date.UTC(2026, 5, 1, 8, 0, 0);

type Device = {
  id: string;
  userId: string;
  office: boolean;
  skewMs: number;
  clock: Hlc;
  pulled: Ledger;
  outbox: Operation[];
};

type Server = {
  ledger: Ledger;
  recorded: Map<string, RecordedOp & { outcome: string }>;
  conflicts: RecordedConflict[];
  lastBounded: Map<string, Stamp>;
  boundedOriginals: Map<string, Stamp>;
  clock: Hlc;
  deliveries: number;
};

export type FuzzOptions = { seed: number; steps?: number };
export type FuzzReport = { seed: number; operations: number; deliveries: number; conflicts: number; outcomes: Record<string, number> };

export class FuzzFailure extends Error {
  constructor(seed: number, step: number, message: string) {
    super(`seed ${seed}, step ${step}: ${message}`);
  }
}

export function runFuzz({ seed, steps = 200 }: FuzzOptions): FuzzReport {
  const rng = seededRandom(seed);
  const visitId = rng.uuid();
  const items = makeItems(rng);
  const pools = { findings: ids(rng, 3), photos: ids(rng, 3), lines: ids(rng, 3) };
  let now = START_MS;
  const server: Server = {
    ledger: emptyLedger(visitId, items),
    recorded: new Map(),
    conflicts: [],
    lastBounded: new Map(),
    boundedOriginals: new Map(),
    clock: { wallMs: now, counter: 0, deviceId: 'server' },
    deliveries: 0,
  };
  const devices: Device[] = Array.from({ length: rng.int(2, 5) }, (_, i) => ({
    id: `dev-${i}`,
    userId: `user-${i}`,
    office: i === 0 && rng.chance(0.5),
    // Up to a day either way; now and then exactly right.
    skewMs: rng.chance(0.3) ? 0 : rng.int(-DAY_MS, DAY_MS),
    clock: { wallMs: 0, counter: 0, deviceId: `dev-${i}` },
    pulled: emptyLedger(visitId, items),
    outbox: [],
  }));

  for (let step = 0; step < steps; step++) {
    now += rng.int(0, 120_000);
    const device = rng.pick(devices);
    const roll = rng.next();
    if (roll < 0.6) device.outbox.push(makeOperation(rng, device, now, items, pools));
    else if (roll < 0.85) push(rng, server, device, now, 'faulty');
    else pull(server, device);
    check(seed, step, server, rng, step % 25 === 24);
  }
  // Quiesce: the network behaves, everyone drains the outbox, then everyone pulls.
  for (const device of devices) push(rng, server, device, now, 'reliable');
  for (const device of devices) pull(server, device);
  check(seed, steps, server, rng, true);
  const expected = describePicture(pictureOf(server.ledger));
  for (const device of devices) {
    const seen = describePicture(pictureOf(localView(device.pulled, device.outbox, { userId: device.userId, role: device.office ? 'office' : 'technician' })));
    if (seen !== expected) throw new FuzzFailure(seed, steps, `device ${device.id} shows ${seen}, the server holds ${expected}`);
  }
  const outcomes: Record<string, number> = {};
  for (const r of server.recorded.values()) outcomes[r.outcome] = (outcomes[r.outcome] ?? 0) + 1;
  return { seed, operations: server.recorded.size, deliveries: server.deliveries, conflicts: server.conflicts.length, outcomes };
}

function ids(rng: Random, n: number) {
  return Array.from({ length: n }, () => rng.uuid());
}

function makeItems(rng: Random): Map<string, ItemKind> {
  const items = new Map<string, ItemKind>();
  for (const kind of ['check', 'check', 'check', 'reading', 'reading', 'reading', 'part', 'part'] as const) items.set(rng.uuid(), kind);
  return items;
}

function itemsOf(items: Map<string, ItemKind>, kind: ItemKind) {
  return [...items].filter(([, k]) => k === kind).map(([id]) => id);
}

function makeOperation(rng: Random, device: Device, now: number, items: Map<string, ItemKind>, pools: Record<'findings' | 'photos' | 'lines', string[]>): Operation {
  device.clock = tick(device.clock, now + device.skewMs);
  const stamp = encodeStamp(device.clock);
  const view = localView(device.pulled, device.outbox, { userId: device.userId, role: device.office ? 'office' : 'technician' });
  const envelope = { opId: rng.uuid(), visitId: view.visitId, deviceId: device.id, stamp };
  const kind = rng.pick(['check', 'reading', 'finding', 'note', 'photo', 'part_line'] as const);
  switch (kind) {
    case 'check': {
      const itemId = rng.pick(itemsOf(items, 'check'));
      return { ...envelope, kind, seenStamp: view.checks.get(itemId)?.stamp ?? null, payload: { itemId, state: rng.pick(CHECK_STATES) } };
    }
    case 'reading': {
      const itemId = rng.pick(itemsOf(items, 'reading'));
      return {
        ...envelope,
        kind,
        seenStamp: view.readings.get(itemId)?.stamp ?? null,
        payload: { itemId, value: rng.int(0, 400) / 10, textValue: null, unit: 'mm' },
      };
    }
    case 'finding': {
      const findingId = rng.pick(pools.findings);
      return {
        ...envelope,
        kind,
        seenStamp: view.findings.get(findingId)?.stamp ?? null,
        payload: {
          findingId,
          itemId: null,
          title: `Finding ${rng.int(1, 9)}`,
          detail: '',
          severity: rng.pick(SEVERITIES),
          downgrade: rng.chance(device.office ? 0.5 : 0.05),
        },
      };
    }
    case 'note':
      return { ...envelope, kind, seenStamp: null, payload: { noteId: rng.uuid(), body: `Note ${rng.int(1, 999)}` } };
    case 'photo': {
      const photoId = rng.pick(pools.photos);
      const standing = view.photos.get(photoId);
      if (standing && standing.removedStamp === null && rng.chance(0.5)) {
        return { ...envelope, kind: 'photo.remove', seenStamp: standing.addStamp, payload: { photoId } };
      }
      return {
        ...envelope,
        kind: 'photo.add',
        seenStamp: standing?.addStamp ?? null,
        payload: {
          photoId,
          findingId: null,
          itemId: null,
          caption: `Photo ${rng.int(1, 99)}`,
          sha256: '0'.repeat(63) + rng.int(0, 9),
          contentType: 'image/jpeg',
          sizeBytes: 1000,
          width: null,
          height: null,
        },
      };
    }
    case 'part_line': {
      const lineId = rng.pick(pools.lines);
      return {
        ...envelope,
        kind,
        seenStamp: view.partLines.get(lineId)?.stamp ?? null,
        payload: {
          lineId,
          itemId: rng.pick(itemsOf(items, 'part')),
          partId: null,
          partNumber: `PN-${rng.int(1, 5)}`,
          description: 'Filter',
          quantity: rng.int(1, 4),
          unit: '{each}',
          removed: rng.chance(0.2),
        },
      };
    }
  }
}

function push(rng: Random, server: Server, device: Device, now: number, network: 'faulty' | 'reliable') {
  while (device.outbox.length > 0) {
    const size = network === 'reliable' ? device.outbox.length : rng.int(1, device.outbox.length);
    const batch = device.outbox.slice(0, size);
    // A device may send an operation twice in one batch after a crash mid-write.
    if (network === 'faulty' && rng.chance(0.1)) batch.push(rng.pick(batch));
    const fault = network === 'faulty' ? rng.next() : 1;
    if (fault < 0.1) return; // the request never arrived
    receiveBatch(server, device, batch, now);
    if (fault < 0.25) return; // applied, but the answer was lost: the device will send it again
    device.outbox = device.outbox.slice(size);
    device.clock = receive(device.clock, server.clock, now + device.skewMs);
    if (network === 'faulty') return;
  }
}

function receiveBatch(server: Server, device: Device, batch: Operation[], now: number) {
  server.deliveries += 1;
  for (const op of batch) {
    if (server.recorded.has(op.opId)) continue;
    const bounded = boundStamp(op.stamp, now, server.lastBounded.get(device.id) ?? null);
    if (bounded.bounded) {
      server.lastBounded.set(device.id, bounded.stamp);
      server.boundedOriginals.set(op.stamp, bounded.stamp);
    }
    server.clock = receive(server.clock, decodeStamp(bounded.stamp), now);
    const seenStamp = normaliseSeen(op.seenStamp, op.deviceId, (s) => server.boundedOriginals.get(s));
    const merged = { ...op, seenStamp } as Operation;
    const applied = applyOperation(server.ledger, { op: merged, stamp: bounded.stamp, author: device.userId, mayDowngrade: device.office });
    server.conflicts.push(...applied.conflicts);
    server.recorded.set(op.opId, { op: merged, stamp: bounded.stamp, mayDowngrade: device.office, outcome: applied.outcome });
  }
}

function pull(server: Server, device: Device) {
  device.pulled = structuredClone(server.ledger);
  device.pulled.dirty.clear();
  device.clock = receive(device.clock, server.clock, device.clock.wallMs);
}

function check(seed: number, step: number, server: Server, rng: Random, replay: boolean) {
  const fail = (message: string) => {
    throw new FuzzFailure(seed, step, message);
  };
  const entries = [...server.ledger.history.values()].flat();
  const perOp = new Map<string, number>();
  for (const e of entries) perOp.set(e.opId, (perOp.get(e.opId) ?? 0) + 1);
  for (const [opId, count] of perOp) if (count !== 1) fail(`operation ${opId} was applied ${count} times`);
  if (perOp.size !== server.recorded.size) fail(`${server.recorded.size} operations recorded but ${perOp.size} in the history`);

  const recorded = [...server.recorded.values()];
  const actual = describePicture(pictureOf(server.ledger));
  const expected = describePicture(modelOf(recorded));
  if (actual !== expected) fail(`server state ${actual} differs from the model ${expected}`);

  const keptInConflicts = new Set(server.conflicts.map((c) => c.proposed.opId));
  for (const r of recorded) {
    if (r.op.kind !== 'reading') continue;
    const standing = server.ledger.readings.get(r.op.payload.itemId);
    if (standing?.opId === r.op.opId) continue;
    const history = historyOf(server.ledger, 'reading', entityIdOf(r.op));
    if (seenByLater(history, r.stamp, r.op.deviceId)) continue;
    if (!keptInConflicts.has(r.op.opId)) fail(`reading operation ${r.op.opId} lost without anyone seeing it and is not in the conflict list`);
  }

  if (replay) {
    const fresh = emptyLedger(server.ledger.visitId, server.ledger.items);
    for (const r of rng.shuffle(recorded)) applyOperation(fresh, { op: r.op, stamp: r.stamp, author: 'replay', mayDowngrade: r.mayDowngrade });
    const replayed = describePicture(pictureOf(fresh));
    if (replayed !== actual) fail(`replaying in another order gives ${replayed}, not ${actual}`);
  }
}
