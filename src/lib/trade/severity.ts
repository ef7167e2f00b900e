// The severity scale of PRODUCT.md, in rising order. Trade judgements suggest one to prefill a
// finding; the technician may always change it.
export const SEVERITIES = ['ok', 'watch', 'soon', 'now'] as const;
export type Severity = (typeof SEVERITIES)[number];

export function worseSeverity(a: Severity | null, b: Severity | null): Severity | null {
  if (a === null) return b;
  if (b === null) return a;
  return SEVERITIES.indexOf(a) >= SEVERITIES.indexOf(b) ? a : b;
}
