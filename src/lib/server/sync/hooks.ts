// Work other areas must do in the same transaction as a push, after its operations are merged
// and written: each hook names the operation kinds it cares about and gets the ids of the visits
// where at least one operation of those kinds was applied. A hook that throws rolls the whole
// push back (nothing is acknowledged), so a hook must only fail when the data is truly wrong.
import type { Transaction } from '../../../db/client';
import type { OperationKind } from '../../sync/operations';
import { reconcileVanStockForVisit } from '../van-stock-reconcile';

export type PostApplyHook = {
  name: string;
  kinds: readonly OperationKind[];
  run(tx: Transaction, visitIds: string[]): Promise<void>;
};

export const POST_APPLY_HOOKS: PostApplyHook[] = [
  // Parts fitted on a visit come off its technician's van; idempotent, so a line pushed twice or
  // changed later writes only the difference (src/lib/server/van-stock-reconcile.ts).
  {
    name: 'van stock',
    kinds: ['part_line'],
    run: async (tx, visitIds) => {
      for (const visitId of visitIds) await reconcileVanStockForVisit(tx, visitId);
    },
  },
];

/** `applied`: for each visit, the kinds of the operations applied to it in this transaction. */
export async function runPostApplyHooks(tx: Transaction, applied: ReadonlyMap<string, ReadonlySet<OperationKind>>): Promise<void> {
  for (const hook of POST_APPLY_HOOKS) {
    const visitIds = [...applied].filter(([, kinds]) => hook.kinds.some((k) => kinds.has(k))).map(([visitId]) => visitId);
    if (visitIds.length) await hook.run(tx, visitIds);
  }
}
