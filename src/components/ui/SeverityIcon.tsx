// Severity is never colour alone: each level has its own shape as well as its own colour.
// ok: a circle with a tick; watch: a square with an eye-dot; soon: a triangle with "!"; now: an
// octagon with a cross. Shapes are ours, drawn inline so they work offline and print.
import type { Severity } from '../../lib/sync/operations';

export const SEVERITY_LABEL: Record<Severity, string> = {
  ok: 'OK',
  watch: 'Watch',
  soon: 'Soon',
  now: 'Now',
};

export const SEVERITY_MEANING: Record<Severity, string> = {
  ok: 'Fine',
  watch: 'Keep an eye on it',
  soon: 'Needs doing soon',
  now: 'Unsafe or urgent',
};

const FILL: Record<Severity, string> = {
  ok: 'var(--color-sev-ok)',
  watch: 'var(--color-sev-watch)',
  soon: 'var(--color-sev-soon)',
  now: 'var(--color-sev-now)',
};

export function SeverityIcon({ severity, size = 24 }: { severity: Severity; size?: number }) {
  const fill = FILL[severity];
  return (
    <svg width={size} height={size} viewBox="0 0 24 24" aria-hidden="true" focusable="false" className="shrink-0">
      {severity === 'ok' && (
        <>
          <circle cx="12" cy="12" r="11" fill={fill} />
          <path d="M6.5 12.5l3.5 3.5 7.5-8" fill="none" stroke="#fff" strokeWidth="2.6" strokeLinecap="round" strokeLinejoin="round" />
        </>
      )}
      {severity === 'watch' && (
        <>
          <rect x="1.5" y="1.5" width="21" height="21" rx="3" fill={fill} />
          <path d="M4.5 12c2-3.6 4.6-5.4 7.5-5.4s5.5 1.8 7.5 5.4c-2 3.6-4.6 5.4-7.5 5.4S6.5 15.6 4.5 12z" fill="none" stroke="#fff" strokeWidth="2" />
          <circle cx="12" cy="12" r="2.4" fill="#fff" />
        </>
      )}
      {severity === 'soon' && (
        <>
          <path d="M12 1.5 23 21.5H1z" fill={fill} strokeLinejoin="round" />
          <path d="M12 8.5v6.5" stroke="#fff" strokeWidth="2.6" strokeLinecap="round" />
          <circle cx="12" cy="18" r="1.5" fill="#fff" />
        </>
      )}
      {severity === 'now' && (
        <>
          <path d="M7.4 1h9.2L23 7.4v9.2L16.6 23H7.4L1 16.6V7.4z" fill={fill} />
          <path d="M8 8l8 8M16 8l-8 8" stroke="#fff" strokeWidth="2.8" strokeLinecap="round" />
        </>
      )}
    </svg>
  );
}

export function SeverityBadge({ severity }: { severity: Severity }) {
  return (
    <span className="inline-flex items-center gap-1.5 rounded-full border-2 bg-white px-2.5 py-0.5 font-bold" style={{ borderColor: FILL[severity], color: FILL[severity] }}>
      <SeverityIcon severity={severity} size={22} />
      {SEVERITY_LABEL[severity]}
    </span>
  );
}
