// How far a visit's checklist has got. Pure: the template and the recorded results in, counts out.
import type { LocalCheckResult, LocalPartLine, LocalReadingResult, LocalTemplateVersion } from './db';

export type ItemOf = LocalTemplateVersion['sections'][number]['items'][number];
export type Progress = { done: number; total: number };

export type Recorded = {
  checks: readonly LocalCheckResult[];
  readings: readonly LocalReadingResult[];
  partLines: readonly LocalPartLine[];
};

/** Marked "not applicable": a check item in the state `skipped`. */
export function itemSkipped(item: ItemOf, recorded: Recorded): boolean {
  return recorded.checks.some((c) => c.itemId === item.id && c.state === 'skipped');
}

/** An item counts as dealt with once ticked or marked not applicable, read, or its part fitted. */
export function itemDone(item: ItemOf, recorded: Recorded): boolean {
  if (itemSkipped(item, recorded)) return true;
  switch (item.kind) {
    case 'check':
      return recorded.checks.some((c) => c.itemId === item.id && c.state === 'done');
    case 'reading':
      return recorded.readings.some((r) => r.itemId === item.id);
    case 'part':
      return recorded.partLines.some((l) => l.itemId === item.id && !l.removed);
  }
}

export function sectionProgress(section: LocalTemplateVersion['sections'][number], recorded: Recorded): Progress {
  const done = section.items.filter((item) => itemDone(item, recorded)).length;
  return { done, total: section.items.length };
}

export function visitProgress(version: LocalTemplateVersion, recorded: Recorded): Progress {
  return version.sections.reduce(
    (sum, section) => {
      const p = sectionProgress(section, recorded);
      return { done: sum.done + p.done, total: sum.total + p.total };
    },
    { done: 0, total: 0 },
  );
}

/** Items not dealt with yet, for the sign-off summary. */
export function itemsLeft(version: LocalTemplateVersion, recorded: Recorded): ItemOf[] {
  return version.sections.flatMap((s) => s.items.filter((item) => !itemDone(item, recorded)));
}
