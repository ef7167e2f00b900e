// Small shapes that carry meaning beside colour, so nothing is told by colour alone: a ring with a
// tick for "enough", a triangle for "short" or "check this", a down arrow for "below minimum".

type MarkProps = { label: string; className?: string };

export function EnoughMark({ label, className = '' }: MarkProps) {
  return (
    <svg viewBox="0 0 20 20" width="20" height="20" role="img" aria-label={label} className={`inline-block shrink-0 text-sev-ok ${className}`}>
      <circle cx="10" cy="10" r="8.5" fill="none" stroke="currentColor" strokeWidth="2.5" />
      <path d="M6 10.5l2.6 2.6L14 7.6" fill="none" stroke="currentColor" strokeWidth="2.5" strokeLinecap="round" strokeLinejoin="round" />
    </svg>
  );
}

export function ShortMark({ label, className = '' }: MarkProps) {
  return (
    <svg viewBox="0 0 20 20" width="20" height="20" role="img" aria-label={label} className={`inline-block shrink-0 text-sev-soon ${className}`}>
      <path d="M10 2L19 18H1z" fill="currentColor" />
      <path d="M10 7.5v5" stroke="white" strokeWidth="2.2" strokeLinecap="round" />
      <circle cx="10" cy="15.2" r="1.2" fill="white" />
    </svg>
  );
}

export function LowMark({ label, className = '' }: MarkProps) {
  return (
    <svg viewBox="0 0 20 20" width="20" height="20" role="img" aria-label={label} className={`inline-block shrink-0 text-sev-now ${className}`}>
      <rect x="1" y="1" width="18" height="18" rx="3" fill="currentColor" />
      <path d="M10 5v9M6 10.5l4 4 4-4" fill="none" stroke="white" strokeWidth="2.2" strokeLinecap="round" strokeLinejoin="round" />
    </svg>
  );
}
