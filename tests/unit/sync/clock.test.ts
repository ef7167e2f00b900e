import { describe, expect, it } from 'vitest';
import { compareStamps, decodeStamp, encodeStamp, receive, tick, type Hlc } from '../../../src/lib/sync/clock';

const at = (wallMs: number, counter = 0, deviceId = 'phone-a'): Hlc => ({ wallMs, counter, deviceId });

describe('hybrid logical clock', () => {
  it('encodes and decodes a stamp', () => {
    const clock = at(1_764_600_000_000, 42, 'phone-a');
    expect(decodeStamp(encodeStamp(clock))).toEqual(clock);
  });

  it('sorts encoded stamps in clock order: wall time, then counter, then device', () => {
    const ordered = [at(5, 0, 'b'), at(5, 1, 'a'), at(5, 1, 'b'), at(6, 0, 'a'), at(1_000_000_000_000, 0, 'a')];
    const stamps = ordered.map(encodeStamp);
    expect([...stamps].sort(compareStamps)).toEqual(stamps);
  });

  it('never goes backwards when the wall clock does', () => {
    const after = tick(at(1000, 3), 400);
    expect(after).toEqual(at(1000, 4));
  });

  it('takes the wall clock when it moves forward', () => {
    expect(tick(at(1000, 3), 2000)).toEqual(at(2000, 0));
  });

  it('moves past a remote stamp that is ahead of us', () => {
    const local = at(1000, 0, 'a');
    const remote = at(5000, 7, 'b');
    const next = receive(local, remote, 1200);
    expect(next).toEqual(at(5000, 8, 'a'));
    expect(compareStamps(encodeStamp(next), encodeStamp(remote))).toBe(1);
  });

  it('rejects a malformed stamp and a bad device id', () => {
    expect(() => decodeStamp('yesterday')).toThrow(/not a clock stamp/);
    expect(() => encodeStamp(at(1, 0, 'has space'))).toThrow(/device id/);
  });
});
