// The server's hybrid logical clock, one per organisation, kept in sync_clocks. It moves past
// every stamp the server accepts (after bounding, so a wrong phone cannot drag it far ahead) and
// stamps the office's own changes, which therefore order after everything already merged.
import { eq, sql } from 'drizzle-orm';
import type { Transaction } from '../../../db/client';
import { syncClocks } from '../../../db/schema';
import { decodeStamp, encodeStamp, receive, tick, type Hlc, type Stamp } from '../../sync/clock';

/** The device id in the stamps of changes the server makes itself (office actions). */
export const SERVER_DEVICE_ID = 'server';

export class ServerClock {
  private constructor(
    private clock: Hlc,
    private readonly organisationId: string,
  ) {}

  /** Loads the clock; call inside the writing transaction. */
  static async load(tx: Transaction, organisationId: string): Promise<ServerClock> {
    const [row] = await tx.select().from(syncClocks).where(eq(syncClocks.organisationId, organisationId));
    const clock = row ? decodeStamp(row.stamp) : { wallMs: 0, counter: 0, deviceId: SERVER_DEVICE_ID };
    return new ServerClock(clock, organisationId);
  }

  receive(stamp: Stamp, nowMs: number): void {
    this.clock = receive(this.clock, decodeStamp(stamp), nowMs);
  }

  /** A new stamp for a change the server makes, later than everything received so far. */
  next(nowMs: number, after?: Stamp): Stamp {
    if (after) this.receive(after, nowMs);
    this.clock = tick(this.clock, nowMs);
    return encodeStamp({ ...this.clock, deviceId: SERVER_DEVICE_ID });
  }

  current(): Stamp {
    return encodeStamp({ ...this.clock, deviceId: SERVER_DEVICE_ID });
  }

  /**
   * Pushes run side by side, so another may have moved the clock since this one loaded it: keep
   * the later of the two (stamps compare as text in clock order, and all of these are the server's).
   */
  async save(tx: Transaction): Promise<void> {
    await tx
      .insert(syncClocks)
      .values({ organisationId: this.organisationId, stamp: this.current() })
      .onConflictDoUpdate({ target: syncClocks.organisationId, set: { stamp: sql`greatest(${syncClocks.stamp}, excluded.stamp)` } });
  }
}
