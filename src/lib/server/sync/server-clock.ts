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
    private readonly existed: boolean,
  ) {}

  /** Loads the clock; call inside the transaction that holds the change-feed lock. */
  static async load(tx: Transaction, organisationId: string): Promise<ServerClock> {
    const [row] = await tx.select().from(syncClocks).where(eq(syncClocks.organisationId, organisationId));
    const clock = row ? decodeStamp(row.stamp) : { wallMs: 0, counter: 0, deviceId: SERVER_DEVICE_ID };
    return new ServerClock(clock, organisationId, Boolean(row));
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

  async save(tx: Transaction): Promise<void> {
    const stamp = this.current();
    if (this.existed) await tx.update(syncClocks).set({ stamp }).where(eq(syncClocks.organisationId, this.organisationId));
    else {
      await tx
        .insert(syncClocks)
        .values({ organisationId: this.organisationId, stamp })
        .onConflictDoUpdate({ target: syncClocks.organisationId, set: { stamp: sql`excluded.stamp` } });
    }
  }
}
