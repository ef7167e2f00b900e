// How a severity reads to a customer, on the page, in the PDF and in e-mail. Colours match the
// theme (sev-* in global.css); each also has a shape, so colour is never the only signal.
import type { Severity } from '../sync/operations';

export const SEVERITY_DISPLAY: Record<Severity, { label: string; shape: 'octagon' | 'triangle' | 'circle' | 'tick'; mark: string; colour: string }> = {
  now: { label: 'Needs doing now', shape: 'octagon', mark: '■', colour: '#b3261e' },
  soon: { label: 'Needs doing soon', shape: 'triangle', mark: '▲', colour: '#a35a00' },
  watch: { label: 'Keep an eye on it', shape: 'circle', mark: '●', colour: '#1d5fa8' },
  ok: { label: 'Fine', shape: 'tick', mark: '✔', colour: '#1f7a3d' },
};
