import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { encodeStamp, type Stamp } from '../../../src/lib/sync/clock';
import { SEVERITIES, SEVERITY_RANK, type Severity } from '../../../src/lib/sync/operations';
import { addSeverityEvent, severityOf, type SeverityLog } from '../../../src/lib/sync/severity-log';

const stamp = (ms: number, device = 'd'): Stamp => encodeStamp({ wallMs: ms, counter: 0, deviceId: device });

type Ev = { ms: number; severity: Severity; reset: boolean };

function fold(events: Ev[]) {
  let log: SeverityLog = { reset: null, raises: [] };
  for (const e of events) {
    log = addSeverityEvent(log, { stamp: stamp(e.ms), severity: e.severity, opId: null }, e.reset ? { seenStamp: null } : null).log;
  }
  return log;
}

// The rule read plainly: the latest reset, and the highest of it and everything stamped after it.
function plainRule(events: Ev[]): Severity {
  const resets = events.filter((e) => e.reset);
  const last = resets.length ? resets.reduce((a, b) => (b.ms > a.ms ? b : a)) : null;
  const counted = last ? events.filter((e) => e === last || e.ms > last.ms) : events;
  return counted.map((e) => e.severity).reduce((a, b) => (SEVERITY_RANK[b] > SEVERITY_RANK[a] ? b : a));
}

const eventsArb = fc
  .uniqueArray(fc.integer({ min: 1, max: 10_000 }), { minLength: 1, maxLength: 12 })
  .chain((stamps) =>
    fc.tuple(...stamps.map((ms) => fc.record({ ms: fc.constant(ms), severity: fc.constantFrom(...SEVERITIES), reset: fc.boolean() }))),
  );

describe('severity log', () => {
  it('agrees with the plain rule in any arrival order, and keeps at most four raises', () => {
    fc.assert(
      fc.property(eventsArb, fc.infiniteStream(fc.nat()), (events, noise) => {
        const shuffled = [...events].sort(() => (noise.next().value % 3) - 1);
        const log = fold(shuffled);
        expect(severityOf(log).severity).toBe(plainRule(events));
        expect(log.raises.length).toBeLessThanOrEqual(4);
      }),
      { numRuns: 500 },
    );
  });

  it('changes nothing when the same event arrives twice', () => {
    const once = fold([{ ms: 5, severity: 'soon', reset: false }]);
    const again = addSeverityEvent(once, { stamp: stamp(5), severity: 'soon', opId: null }, null);
    expect(again.changed).toBe(false);
  });
});
