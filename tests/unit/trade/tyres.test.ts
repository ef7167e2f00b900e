// Tread depth: UK Road Vehicles (Construction and Use) Regulations 1986 reg. 27(1)(g) and Council
// Directive 89/459/EEC, 1.6 mm ([FOUND] TRADE-REFERENCES §7); US 2/32 in (1.5875 mm) from state
// inspection rules, e.g. Maryland COMAR 11.22.04.06 ([FOUND]). Margins above the law (3 mm soon,
// 4 mm watch): common practice. Tyre pressure: FMVSS 138 25 % warning ([FOUND] §7); 10 %: common practice.
import { describe, expect, it } from 'vitest';
import { judgeTreadDepth, judgeTyrePressure } from '../../../src/lib/trade';

describe('judgeTreadDepth', () => {
  it('UK car: 1.6 mm is legal, 1.59 mm is not (reg. 27(1)(g); §7 check cases)', () => {
    expect(judgeTreadDepth({ depthMm: 1.6, region: 'UK' })).toMatchObject({ legal: true, legalMinimumMm: 1.6 });
    expect(judgeTreadDepth({ depthMm: 1.59, region: 'UK' })).toMatchObject({ legal: false, status: 'illegal', severity: 'now' });
  });

  it('EU: 1.6 mm (Directive 89/459/EEC); the default region is the UK', () => {
    expect(judgeTreadDepth({ depthMm: 1.59, region: 'EU' }).legal).toBe(false);
    expect(judgeTreadDepth({ depthMm: 1.5 }).region).toBe('UK');
  });

  it('US car: 1.59 mm is legal (≥ 1.5875 mm = 2/32 in), 1.58 mm is not (§7 check cases)', () => {
    expect(judgeTreadDepth({ depthMm: 1.59, region: 'US' }).legal).toBe(true);
    expect(judgeTreadDepth({ depthMm: 1.58, region: 'US' }).legal).toBe(false);
    expect(judgeTreadDepth({ depthMm: 1.5875, region: 'US' }).legal).toBe(true);
    expect(judgeTreadDepth({ depthMm: 1, region: 'US' }).legalMinimumMm).toBe(1.5875);
  });

  it('margins (common practice): below 3 mm soon, below 4 mm watch, from 4 mm ok', () => {
    expect(judgeTreadDepth({ depthMm: 2.5 })).toMatchObject({ status: 'soon', severity: 'soon', legal: true });
    expect(judgeTreadDepth({ depthMm: 2.99 }).status).toBe('soon');
    expect(judgeTreadDepth({ depthMm: 3 }).status).toBe('watch');
    expect(judgeTreadDepth({ depthMm: 3.99 }).status).toBe('watch');
    expect(judgeTreadDepth({ depthMm: 4 })).toMatchObject({ status: 'ok', severity: 'ok' });
    expect(judgeTreadDepth({ depthMm: 3.5, soonBelowMm: 4, watchBelowMm: 5 }).status).toBe('soon');
  });

  it('refuses impossible depths and unknown regions', () => {
    expect(() => judgeTreadDepth({ depthMm: -1 })).toThrow(/cannot be negative/);
    expect(() => judgeTreadDepth({ depthMm: 40 })).toThrow(/deeper than any car tyre/);
    expect(() => judgeTreadDepth({ depthMm: 3, region: 'Mars' })).toThrow(/not a region/);
    expect(() => judgeTreadDepth({ depthMm: Number.NaN })).toThrow(/must be a number/);
  });
});

describe('judgeTyrePressure', () => {
  it('25 % or more under the figure is serious (FMVSS 138 warning threshold: 240 kPa → 180 kPa)', () => {
    expect(judgeTyrePressure(180, 240)).toMatchObject({ status: 'seriously_under', severity: 'soon', deviationPercent: -25 });
    expect(judgeTyrePressure(181, 240).status).toBe('off');
  });

  it('more than 10 % off either way is noted; within 10 % is fine (common practice)', () => {
    expect(judgeTyrePressure(216, 240).status).toBe('ok');
    expect(judgeTyrePressure(215, 240).status).toBe('off');
    expect(judgeTyrePressure(270, 240)).toMatchObject({ status: 'off', severity: 'watch' });
  });
});
