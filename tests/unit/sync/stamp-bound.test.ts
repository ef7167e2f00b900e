import { describe, expect, it } from 'vitest';
import { compareStamps, decodeStamp, encodeStamp } from '../../../src/lib/sync/clock';
import { boundStamp, MAX_CLOCK_LEAD_MS, normaliseSeen } from '../../../src/lib/sync/stamp-bound';

const NOW = Date.UTC(2026, 4, 1, 12, 0, 0);
const at = (ms: number, counter = 0, device = 'phone-a') => encodeStamp({ wallMs: ms, counter, deviceId: device });

describe('bounding stamps from clocks that run ahead', () => {
  it('leaves a stamp within the lead alone', () => {
    const s = at(NOW + MAX_CLOCK_LEAD_MS);
    expect(boundStamp(s, NOW, null)).toEqual({ stamp: s, bounded: false });
  });

  it('bounds a phone set a year ahead to the server time plus the lead, keeping the device', () => {
    const result = boundStamp(at(NOW + 365 * 86_400_000), NOW, null);
    expect(result.bounded).toBe(true);
    expect(decodeStamp(result.stamp)).toEqual({ wallMs: NOW + MAX_CLOCK_LEAD_MS, counter: 0, deviceId: 'phone-a' });
  });

  it('keeps the order of one device’s bounded stamps within the same millisecond', () => {
    const first = boundStamp(at(NOW + 86_400_000), NOW, null);
    const second = boundStamp(at(NOW + 86_400_001), NOW, first.stamp);
    expect(compareStamps(second.stamp, first.stamp)).toBe(1);
  });

  it('lets a later honest stamp win once the lead has passed', () => {
    const bounded = boundStamp(at(NOW + 86_400_000), NOW, null).stamp;
    const honest = at(NOW + MAX_CLOCK_LEAD_MS + 1, 0, 'phone-b');
    expect(compareStamps(honest, bounded)).toBe(1);
  });

  it('translates a device’s own seen stamp to the bounded one, and nothing else', () => {
    const original = at(NOW + 86_400_000);
    const bounded = at(NOW + MAX_CLOCK_LEAD_MS);
    const lookup = (s: string) => (s === original ? bounded : undefined);
    expect(normaliseSeen(original, 'phone-a', lookup)).toBe(bounded);
    expect(normaliseSeen(original, 'phone-b', lookup)).toBe(original);
    expect(normaliseSeen(null, 'phone-a', lookup)).toBeNull();
  });
});
