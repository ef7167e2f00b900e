// What the phone keeps when a pulled row meets a change of its own that the server has not seen
// yet. Pure: stamps in, decision out. The server settles the value for good once the outbox
// drains; until then the technician must keep seeing what they recorded.
import type { Severity } from '../sync/operations';
import { SEVERITY_RANK } from './visit-actions';

/**
 * Keep the local value while an unsent change to the same thing is later than the pulled one.
 * A pulled value stamped later than every unsent change would win on the server anyway.
 */
export function keepLocal(pulledStamp: string, unsentStamps: readonly string[]): boolean {
  return unsentStamps.some((stamp) => stamp > pulledStamp);
}

/** A finding's severity never drops on the phone because of a pull while a raise is unsent. */
export function severityToShow(local: Severity, pulled: Severity, hasUnsent: boolean): Severity {
  if (!hasUnsent) return pulled;
  return SEVERITY_RANK[local] >= SEVERITY_RANK[pulled] ? local : pulled;
}
