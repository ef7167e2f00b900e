// Severity is never colour alone: each level has its own shape as well as its colour and word.
//   ok: a circle with a tick · watch: a diamond · soon: a triangle with ! · now: an octagon with !
import type { Severity } from '../../lib/sync/operations';

export const SEVERITY_LABEL: Record<Severity, string> = { ok: 'OK', watch: 'Watch', soon: 'Soon', now: 'Now' };

const COLOUR: Record<Severity, string> = {
  ok: 'var(--color-sev-ok)',
  watch: 'var(--color-sev-watch)',
  soon: 'var(--color-sev-soon)',
  now: 'var(--color-sev-now)',
};

export function SeverityIcon({ severity, size = 18 }: { severity: Severity; size?: number }) {
  const fill = COLOUR[severity];
  return (
    <svg width={size} height={size} viewBox="0 0 20 20" aria-hidden="true" focusable="false" className="shrink-0">
      {severity === 'ok' && (
        <>
          <circle cx="10" cy="10" r="9" fill={fill} />
          <path d="M5.5 10.5l3 3 6-7" fill="none" stroke="white" strokeWidth="2.2" strokeLinecap="round" strokeLinejoin="round" />
        </>
      )}
      {severity === 'watch' && (
        <>
          <path d="M10 1l9 9-9 9-9-9z" fill={fill} />
          <circle cx="10" cy="10" r="2.6" fill="white" />
        </>
      )}
      {severity === 'soon' && (
        <>
          <path d="M10 1.5l9 16.5H1z" fill={fill} />
          <path d="M10 7v5.5" stroke="white" strokeWidth="2.2" strokeLinecap="round" />
          <circle cx="10" cy="15.3" r="1.3" fill="white" />
        </>
      )}
      {severity === 'now' && (
        <>
          <path d="M6.3 1h7.4L19 6.3v7.4L13.7 19H6.3L1 13.7V6.3z" fill={fill} />
          <path d="M10 5v6.5" stroke="white" strokeWidth="2.4" strokeLinecap="round" />
          <circle cx="10" cy="14.8" r="1.4" fill="white" />
        </>
      )}
    </svg>
  );
}

export function SeverityBadge({ severity, size = 18 }: { severity: Severity; size?: number }) {
  return (
    <span className="inline-flex items-center gap-1 font-bold" style={{ color: COLOUR[severity] }}>
      <SeverityIcon severity={severity} size={size} />
      {SEVERITY_LABEL[severity]}
    </span>
  );
}
