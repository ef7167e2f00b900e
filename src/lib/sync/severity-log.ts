// Finding severity: the higher severity wins, so a warning is never silently lowered; only an
// explicit downgrade by the office lowers it (PRODUCT.md, merge rules).
//
// Read as a rule over the set of severity events a finding has received: the office's latest
// downgrade is a reset, and the severity is the highest of that reset and every event stamped
// after it. Evaluated that way the result does not depend on the order events arrive in, which a
// naive "max, unless a downgrade came in" does not give (a raise arriving after a later-stamped
// downgrade would win or lose depending on arrival).
//
// The log keeps just enough to evaluate that rule for any reset still to come: the latest reset,
// and the events after it that no other event dominates (one with a later stamp and a severity at
// least as high makes an event irrelevant). Ranks are strictly falling along increasing stamps,
// so the list never holds more than four events.
import { compareStamps, type Stamp } from './clock';
import { SEVERITY_RANK, type Severity } from './operations';

/** `author`: who set it, where known (older logs and pulled copies may not say). */
export type SeverityEvent = { stamp: Stamp; severity: Severity; opId: string | null; author?: string | null };
/** A reset remembers what it had seen, to tell a deliberate downgrade from an unseen raise. */
export type SeverityReset = SeverityEvent & { seenStamp: Stamp | null };
export type SeverityLog = { reset: SeverityReset | null; raises: SeverityEvent[] };

export type SeverityChange = {
  log: SeverityLog;
  changed: boolean;
  /** The event arrived stamped before the standing reset, so the reset overrules it. */
  overruled: boolean;
  /** Events a new reset removed although it had not seen them and they were higher. */
  droppedUnseen: SeverityEvent[];
};

const rank = (s: Severity) => SEVERITY_RANK[s];

export function logOfSingleEvent(event: SeverityEvent): SeverityLog {
  return { reset: null, raises: [event] };
}

/** Adds an event from anyone; `isReset` only for the office's explicit downgrade. */
export function addSeverityEvent(log: SeverityLog, event: SeverityEvent, reset: { seenStamp: Stamp | null } | null): SeverityChange {
  if (log.reset && compareStamps(event.stamp, log.reset.stamp) <= 0) {
    return { log, changed: false, overruled: true, droppedUnseen: [] };
  }
  if (reset) return applyReset(log, { ...event, seenStamp: reset.seenStamp });
  const raises = paretoInsert(log.raises, event);
  const changed = raises !== log.raises;
  return { log: changed ? { reset: log.reset, raises } : log, changed, overruled: false, droppedUnseen: [] };
}

function applyReset(log: SeverityLog, reset: SeverityReset): SeverityChange {
  const kept = log.raises.filter((e) => compareStamps(e.stamp, reset.stamp) > 0);
  const dropped = log.raises.filter((e) => compareStamps(e.stamp, reset.stamp) < 0);
  const droppedUnseen = dropped.filter(
    (e) => rank(e.severity) > rank(reset.severity) && (reset.seenStamp === null || compareStamps(reset.seenStamp, e.stamp) < 0),
  );
  return { log: { reset, raises: kept }, changed: true, overruled: false, droppedUnseen };
}

/** Inserts unless dominated; removes what the new event dominates. Returns the same array if unchanged. */
function paretoInsert(events: SeverityEvent[], event: SeverityEvent): SeverityEvent[] {
  const dominated = events.some(
    (e) => compareStamps(e.stamp, event.stamp) >= 0 && rank(e.severity) >= rank(event.severity),
  );
  if (dominated) return events;
  const survivors = events.filter(
    (e) => !(compareStamps(event.stamp, e.stamp) >= 0 && rank(event.severity) >= rank(e.severity)),
  );
  return [...survivors, event].sort((a, b) => compareStamps(a.stamp, b.stamp));
}

/** The severity the log stands for, and the event that set it. */
export function severityOf(log: SeverityLog): SeverityEvent {
  const candidates: SeverityEvent[] = log.reset ? [log.reset, ...log.raises] : log.raises;
  if (candidates.length === 0) throw new Error('a severity log needs at least one event');
  let best = candidates[0]!;
  for (const e of candidates.slice(1)) {
    const byRank = rank(e.severity) - rank(best.severity);
    if (byRank > 0 || (byRank === 0 && compareStamps(e.stamp, best.stamp) > 0)) best = e;
  }
  return best;
}
