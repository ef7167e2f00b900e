// POST /api/sync/push as a service: one transaction under the organisation's change-feed lock.
import type { Database } from '../../../db/client';
import { withChangeFeedWrite } from '../change-feed';
import type { PushRequest, PushResponse } from '../../sync/push';
import { applyBatch, type Pusher } from './apply-batch';
import { ServerClock } from './server-clock';

/** `db` is the app's database unless a caller (the demo seed) writes to another one. */
export async function pushOperations(user: Pusher, request: PushRequest, nowMs = Date.now(), db?: Database): Promise<PushResponse> {
  return withChangeFeedWrite(
    user.organisationId,
    async (tx) => {
      const clock = await ServerClock.load(tx, user.organisationId);
      const results = await applyBatch(tx, user, request.deviceId, request.operations, clock, nowMs);
      await clock.save(tx);
      return { results, serverStamp: clock.current() };
    },
    db,
  );
}
