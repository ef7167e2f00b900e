// Tyres: legal minimum tread depth by region, with the trade's margins above it, and cold
// inflation pressure against the vehicle's figure.
import { finite, nonNegative, positive } from './guard';
import type { Severity } from './severity';

export const TREAD_REGIONS = ['UK', 'EU', 'US'] as const;
export type TreadRegion = (typeof TREAD_REGIONS)[number];

// The legal minimum for cars and light vans:
// - UK: Road Vehicles (Construction and Use) Regulations 1986, reg. 27(1)(g): 1.6 mm in a
//   continuous band across the central three-quarters of the tread, all the way round.
// - EU: Council Directive 89/459/EEC: 1.6 mm in the main grooves of the central zone (about
//   three-quarters of the tread width).
// - US: 2/32 in (1.5875 mm), the common state inspection rule for vehicles of 10 000 lb GVWR or
//   less (e.g. Maryland COMAR 11.22.04.06; 49 CFR 570.9 from memory).
const LEGAL: Record<TreadRegion, { minMm: number; source: string }> = {
  UK: { minMm: 1.6, source: 'Road Vehicles (Construction and Use) Regulations 1986, reg. 27(1)(g): 1.6 mm across the central three-quarters' },
  EU: { minMm: 1.6, source: 'Council Directive 89/459/EEC: 1.6 mm in the main grooves of the central three-quarters' },
  US: { minMm: (2 / 32) * 25.4, source: 'US state inspection rules (2/32 in, e.g. Maryland COMAR 11.22.04.06)' },
};

// Margins above the law (common practice): wet braking worsens well before the legal limit, and
// the trade advises replacing at 3 mm and watching from 4 mm.
const SOON_BELOW_MM = 3;
const WATCH_BELOW_MM = 4;
// A tyre with more than this is new or mis-measured; passenger car tyres start at about 8–9 mm.
const DEEPEST_PLAUSIBLE_MM = 25;

export type TreadJudgement = {
  depthMm: number;
  region: TreadRegion;
  legalMinimumMm: number;
  legal: boolean;
  status: 'illegal' | 'soon' | 'watch' | 'ok';
  severity: Severity;
  message: string;
  source: string;
};

export function judgeTreadDepth(input: { depthMm: number; region?: TreadRegion | string | null; soonBelowMm?: number; watchBelowMm?: number }): TreadJudgement {
  const depthMm = nonNegative('The tread depth (mm)', input?.depthMm);
  if (depthMm > DEEPEST_PLAUSIBLE_MM) throw new Error(`${depthMm} mm is deeper than any car tyre's tread: check the gauge reading`);
  const region = (input.region ?? 'UK').toString().toUpperCase() as TreadRegion;
  if (!TREAD_REGIONS.includes(region)) throw new Error(`"${input.region}" is not a region with a tread rule here: use ${TREAD_REGIONS.join(', ')}`);
  const soonBelow = input.soonBelowMm == null ? SOON_BELOW_MM : positive('The replace-soon margin (mm)', input.soonBelowMm);
  const watchBelow = input.watchBelowMm == null ? WATCH_BELOW_MM : positive('The watch margin (mm)', input.watchBelowMm);
  const { minMm, source } = LEGAL[region];
  const legalText = region === 'US' ? '2/32 in (1.6 mm)' : `${minMm} mm`;
  // A gauge reads to 0.1 mm at best; compare with a hair of tolerance so that 1.6 typed is 1.6.
  const legal = depthMm >= minMm - 1e-9;
  const base = { depthMm, region, legalMinimumMm: minMm, legal, source: `${source}; margins above it: common practice` };
  if (!legal) {
    return { ...base, status: 'illegal', severity: 'now', message: `${depthMm} mm is below the legal minimum of ${legalText}: the tyre must be replaced before the car is driven.` };
  }
  if (depthMm < soonBelow) {
    return { ...base, status: 'soon', severity: 'soon', message: `${depthMm} mm is legal but below ${soonBelow} mm, where wet grip falls away: advise replacing soon.` };
  }
  if (depthMm < watchBelow) {
    return { ...base, status: 'watch', severity: 'watch', message: `${depthMm} mm: legal, getting low. Check again at the next visit.` };
  }
  return { ...base, status: 'ok', severity: 'ok', message: `${depthMm} mm: fine.` };
}

// ---------------------------------------------------------------------------------------------
// Cold inflation pressure against the vehicle's figure. FMVSS No. 138 requires a tyre pressure
// warning when a tyre is 25 % or more below the placard cold pressure; we treat that as a finding
// to act on, and more than 10 % off either way as one to note (common practice).

export const TYRE_PRESSURE_SOURCE = 'FMVSS No. 138 (49 CFR 571.138): warning at 25 % below the placard cold pressure; 10 % tolerance: common practice';
const SERIOUSLY_UNDER = 0.25;
const NOTICEABLY_OFF = 0.1;

export type TyrePressureJudgement = {
  measuredKpa: number;
  specKpa: number;
  deviationPercent: number;
  status: 'ok' | 'off' | 'seriously_under';
  severity: Severity;
  message: string;
  source: string;
};

export function judgeTyrePressure(measuredKpa: number, specKpa: number): TyrePressureJudgement {
  const measured = nonNegative('The tyre pressure (kPa)', measuredKpa);
  const spec = positive("The vehicle's tyre pressure (kPa)", specKpa);
  if (measured > 1000) throw new Error(`${measured} kPa is not a car tyre pressure: check the unit (kPa, not Pa)`);
  const deviation = (measured - spec) / spec;
  const deviationPercent = Math.round(finite('deviation', deviation) * 1000) / 10;
  const base = { measuredKpa: measured, specKpa: spec, deviationPercent, source: TYRE_PRESSURE_SOURCE };
  if (deviation <= -SERIOUSLY_UNDER) {
    return { ...base, status: 'seriously_under', severity: 'soon', message: `${measured} kPa is ${-deviationPercent} % under the ${spec} kPa figure: look for a puncture or a leaking valve.` };
  }
  if (Math.abs(deviation) > NOTICEABLY_OFF) {
    const word = deviation < 0 ? 'under' : 'over';
    return { ...base, status: 'off', severity: 'watch', message: `${measured} kPa is ${Math.abs(deviationPercent)} % ${word} the ${spec} kPa figure: set it cold to the vehicle's figure.` };
  }
  return { ...base, status: 'ok', severity: 'ok', message: `${measured} kPa: within 10 % of the vehicle's ${spec} kPa.` };
}
