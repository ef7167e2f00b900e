// Stable ids for demo rows, so seeding twice finds the rows it made the first time.
import { createHash } from 'node:crypto';

/** A UUID (version 5 layout) from a name: the same name always gives the same id. */
export function seedId(...parts: (string | number)[]): string {
  const hex = createHash('sha1').update(`tickover-demo:${parts.join(':')}`).digest('hex');
  const variant = ((parseInt(hex.slice(16, 18), 16) & 0x3f) | 0x80).toString(16);
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-5${hex.slice(13, 16)}-${variant}${hex.slice(18, 20)}-${hex.slice(20, 32)}`;
}
