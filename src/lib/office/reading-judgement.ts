// How a recorded reading looks to the office: the same trade judgement the phone's number pad
// gives (lib/trade judgeReading), with the checklist item's range and the vehicle's spec.
import { judgeReading, type ReadingContext, type Severity } from '../trade';

export type ReadingItem = { unit: string | null; expectedMin: number | null; expectedMax: number | null; rule: string | null };
export type RecordedReading = { value: number | null; textValue: string | null; unit: string | null };
export type Judgement = { severity: Severity | null; verdict: string; message: string; source: string | null };

const VERDICT_WORDS: Record<string, string> = {
  ok: 'Fine.',
  attention: 'Needs attention.',
  out_of_range: 'Outside the expected range.',
  invalid: 'Could not be judged.',
};

export function judgeRecordedReading(item: ReadingItem, reading: RecordedReading, vehicle: ReadingContext['vehicle']): Judgement {
  const value = reading.value ?? reading.textValue ?? '';
  const judged = judgeReading(
    { value },
    { rule: item.rule, unit: reading.unit ?? item.unit ?? '', expectedMin: item.expectedMin, expectedMax: item.expectedMax, vehicle },
  );
  return {
    severity: judged.suggestedSeverity,
    verdict: judged.verdict,
    message: judged.messages.length ? judged.messages.join(' ') : VERDICT_WORDS[judged.verdict] ?? judged.verdict,
    source: judged.source,
  };
}
