// Finding: the higher severity wins and only the office lowers it, by saying so (see
// severity-log for why that is a rule over the set of events); title, detail and item: the
// later stamp wins. A warning that an office downgrade overruled without having seen it goes
// to the conflict list, so it is never lowered silently.
import { compareStamps } from './clock';
import { SEVERITY_RANK, type Severity } from './operations';
import { asStanding, type StandingFinding } from './standing';
import { addSeverityEvent, logOfSingleEvent, severityOf, type SeverityEvent, type SeverityLog } from './severity-log';
import { isLater, unchanged, type ConflictDraft, type ConflictSide, type Incoming, type Merged } from './merge-result';

export function mergeFinding(standing: StandingFinding | null, incoming: Incoming<'finding'>): Merged<StandingFinding> {
  const { op } = incoming;
  const p = op.payload;
  const event: SeverityEvent = { stamp: incoming.stamp, severity: p.severity, opId: op.opId, author: incoming.author };
  const isReset = p.downgrade && incoming.mayDowngrade;
  const reason = p.downgrade && !incoming.mayDowngrade ? 'only the office can lower a severity' : undefined;

  if (!standing) {
    const log: SeverityLog = isReset ? { reset: { ...event, seenStamp: op.seenStamp }, raises: [] } : logOfSingleEvent(event);
    return withReason({ outcome: 'applied', next: build(fieldsOf(incoming), incoming.stamp, log, incoming.author), conflicts: [] }, reason);
  }

  const fieldsWin = isLater(incoming.stamp, standing.stamp);
  const change = addSeverityEvent(standing.severityLog, event, isReset ? { seenStamp: op.seenStamp } : null);
  const side = findingSide(incoming);
  const conflicts: ConflictDraft[] = change.droppedUnseen.map((dropped) => ({
    kind: 'finding',
    entityId: p.findingId,
    proposed: { value: { severity: dropped.severity }, stamp: dropped.stamp, opId: dropped.opId, author: dropped.author ?? null },
    standing: side,
  }));

  if (!fieldsWin && !change.changed) {
    const reset = standing.severityLog.reset;
    const overruledWarning =
      change.overruled &&
      !isReset &&
      reset !== null &&
      SEVERITY_RANK[p.severity] > SEVERITY_RANK[reset.severity] &&
      !(reset.seenStamp !== null && compareStamps(reset.seenStamp, incoming.stamp) >= 0);
    if (overruledWarning) {
      return unchanged('conflict', 'the office lowered this severity without having seen this warning', [
        { kind: 'finding', entityId: p.findingId, proposed: side, standing: standingSide(standing) },
      ]);
    }
    return unchanged('superseded', reason ?? 'a later change to this finding stands');
  }

  const fields = fieldsWin ? fieldsOf(incoming) : { itemId: standing.itemId, title: standing.title, detail: standing.detail };
  const next = build(fields, fieldsWin ? incoming.stamp : standing.stamp, change.log, standing.author);
  const kept = !isReset && SEVERITY_RANK[p.severity] < SEVERITY_RANK[next.severity];
  return withReason({ outcome: 'applied', next, conflicts }, reason ?? (kept ? `the severity stays ${next.severity}: only the office lowers it` : undefined));
}

type Fields = { itemId: string | null; title: string; detail: string };

function fieldsOf(incoming: Incoming<'finding'>): Fields {
  const { itemId, title, detail } = incoming.op.payload;
  return { itemId, title, detail };
}

function build(fields: Fields, stamp: StandingFinding['stamp'], log: SeverityLog, author: string | null): StandingFinding {
  const severity = severityOf(log);
  return asStanding({ ...fields, stamp, severity: severity.severity, severityStamp: severity.stamp, severityLog: log, author });
}

function findingSide(incoming: Incoming<'finding'>): ConflictSide {
  const { title, detail, severity } = incoming.op.payload;
  return { value: { title, detail, severity }, stamp: incoming.stamp, opId: incoming.op.opId, author: incoming.author };
}

/** The finding as it stands, attributed to whoever set its severity. */
function standingSide(f: StandingFinding): ConflictSide {
  const value: { title: string; detail: string; severity: Severity } = { title: f.title, detail: f.detail, severity: f.severity };
  const setBy = severityOf(f.severityLog);
  return { value, stamp: f.severityStamp, opId: setBy.opId, author: setBy.author ?? f.author };
}

function withReason<S>(merged: Merged<S>, reason: string | undefined): Merged<S> {
  return reason === undefined ? merged : { ...merged, reason };
}
