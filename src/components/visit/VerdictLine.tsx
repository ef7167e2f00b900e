// A reading's judgement: an icon shape and words, never colour alone.
import type { Severity } from '../../lib/sync/operations';
import { SeverityIcon } from '../ui/SeverityIcon';
import type { ReadingJudgement } from './judge';

export const VERDICT_LABEL: Record<ReadingJudgement['verdict'], string> = {
  ok: 'Within range',
  attention: 'Check this',
  out_of_range: 'Out of range',
  invalid: 'Cannot be recorded',
};

const VERDICT_SHAPE: Record<Exclude<ReadingJudgement['verdict'], 'invalid'>, Severity> = { ok: 'ok', attention: 'watch', out_of_range: 'soon' };

export function verdictShape(judgement: ReadingJudgement): Severity | null {
  if (judgement.verdict === 'invalid') return null;
  if (judgement.verdict === 'ok') return 'ok';
  return judgement.suggestedSeverity && judgement.suggestedSeverity !== 'ok' ? judgement.suggestedSeverity : VERDICT_SHAPE[judgement.verdict];
}

export function VerdictIcon({ judgement, size = 24 }: { judgement: ReadingJudgement; size?: number }) {
  const shape = verdictShape(judgement);
  if (!shape) {
    return (
      <svg width={size} height={size} viewBox="0 0 24 24" aria-hidden="true" className="shrink-0">
        <circle cx="12" cy="12" r="10" fill="none" stroke="var(--color-sev-now)" strokeWidth="3" />
        <path d="M5 19 19 5" stroke="var(--color-sev-now)" strokeWidth="3" />
      </svg>
    );
  }
  return <SeverityIcon severity={shape} size={size} />;
}
