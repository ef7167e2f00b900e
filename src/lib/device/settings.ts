// Settings of this phone (not of the business): the technician's own torque wrench and where
// they work, both used when a reading is judged. Kept in idb-keyval beside the signed-in user.
import { get, set } from 'idb-keyval';

export type WrenchRange = { minNm: number; maxNm: number };
export type TreadRegion = 'UK' | 'EU' | 'US';

const WRENCH_KEY = 'tickover:wrench';
const REGION_KEY = 'tickover:region';

export async function readWrench(): Promise<WrenchRange | null> {
  return (await get<WrenchRange>(WRENCH_KEY)) ?? null;
}

/** The marked range of the wrench (ISO 6789-1:2017 calibrates from the lowest marked value). */
export function validateWrench(minNm: number, maxNm: number): string | null {
  if (!Number.isFinite(minNm) || !Number.isFinite(maxNm)) return 'Type both ends of the range as numbers.';
  if (minNm <= 0) return 'The lowest marked value must be above 0 N·m.';
  if (maxNm <= minNm) return 'The highest marked value must be above the lowest.';
  if (maxNm > 3000) return 'That is more than any hand torque wrench reads. Check the figure.';
  return null;
}

export async function saveWrench(range: WrenchRange | null): Promise<void> {
  await set(WRENCH_KEY, range);
}

export async function readRegion(): Promise<TreadRegion> {
  return (await get<TreadRegion>(REGION_KEY)) ?? 'UK';
}

export async function saveRegion(region: TreadRegion): Promise<void> {
  await set(REGION_KEY, region);
}

const STORAGE_NOTICE_KEY = 'tickover:storage-notice-seen';

/** The round says once that the browser refused to keep our data; This phone always says it. */
export async function storageNoticeSeen(): Promise<boolean> {
  return (await get<boolean>(STORAGE_NOTICE_KEY)) === true;
}

export async function markStorageNoticeSeen(): Promise<void> {
  await set(STORAGE_NOTICE_KEY, true);
}
