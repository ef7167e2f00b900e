// How a UCUM code reads on screen.
const LABELS: Record<string, string> = {
  'N.m': 'N·m',
  Cel: '°C',
  '[degF]': '°F',
  '[mi_i]': 'mi',
  '[psi]': 'psi',
  '{each}': '',
  '{grade}': '',
};

export function unitLabel(code: string | null | undefined): string {
  if (!code) return '';
  return LABELS[code] ?? code;
}
