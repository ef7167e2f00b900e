// A phone's unsent changes saved to a file: what a technician whose phone cannot reach the server
// (no signal for days, a broken phone on its way out) hands to the office, who imports it through
// the same push as a sync (POST /api/office/unsent-changes). Our own format, JSON:
//
//   { format: 'tickover.unsent-changes', version: 1, createdAt, user, deviceId, lastSyncedAt,
//     operations: [outbox entries in order], photos: [{ sha256, contentType, base64 }] }
//
// Operations keep their op ids, so importing a file twice, or after the phone synced after all,
// changes nothing the second time (the server answers `duplicate`). Photos carry their bytes in
// base64 when the phone still holds them; a photo whose bytes already reached the server is named
// by its operation only.
import { z } from 'zod';
import { operationSchema } from './operations';

export const UNSENT_FILE_FORMAT = 'tickover.unsent-changes';
export const UNSENT_FILE_VERSION = 1;
/** A day of photos downscaled to 1600 px is tens of megabytes; the import refuses more than this. */
export const MAX_UNSENT_FILE_BYTES = 64 * 1024 * 1024;

const BASE64 = /^[A-Za-z0-9+/]*={0,2}$/;

export const unsentPhotoSchema = z.object({
  sha256: z.string().regex(/^[0-9a-f]{64}$/, 'must be a lower-case hex SHA-256'),
  contentType: z.enum(['image/jpeg', 'image/png', 'image/webp']),
  base64: z.string().min(1).refine((b) => b.length % 4 === 0 && BASE64.test(b), 'is not base64'),
});

export const unsentEntrySchema = z.object({
  // Entries the server refused before stay in the file with the reason, so the office sees them.
  state: z.enum(['pending', 'rejected']),
  reason: z.string().nullable(),
  createdAt: z.iso.datetime({ offset: true }),
  op: operationSchema,
});

export const unsentFileSchema = z
  .object({
    format: z.literal(UNSENT_FILE_FORMAT, { error: `is not a file of unsent changes (format must be ${UNSENT_FILE_FORMAT})` }),
    version: z.literal(UNSENT_FILE_VERSION, { error: `must be ${UNSENT_FILE_VERSION}; this file was saved by another version of the app` }),
    createdAt: z.iso.datetime({ offset: true }),
    user: z.object({ id: z.string().min(1), name: z.string(), email: z.string() }),
    deviceId: z.string().regex(/^[A-Za-z0-9_-]{1,64}$/),
    lastSyncedAt: z.iso.datetime({ offset: true }).nullable(),
    operations: z.array(unsentEntrySchema),
    photos: z.array(unsentPhotoSchema),
  })
  .superRefine((file, ctx) => {
    file.operations.forEach((entry, index) => {
      if (entry.op.deviceId !== file.deviceId) {
        ctx.addIssue({ code: 'custom', path: ['operations', index, 'op', 'deviceId'], message: `differs from the file's device ${file.deviceId}` });
      }
    });
    const seen = new Set<string>();
    file.operations.forEach((entry, index) => {
      if (seen.has(entry.op.opId)) ctx.addIssue({ code: 'custom', path: ['operations', index, 'op', 'opId'], message: 'appears twice in the file' });
      seen.add(entry.op.opId);
    });
  });

export type UnsentFile = z.infer<typeof unsentFileSchema>;
export type UnsentEntry = z.infer<typeof unsentEntrySchema>;

/** The file's name: who, and when, so several saved files sort and never overwrite each other. */
export function unsentFileName(userName: string, createdAt: string): string {
  const who = userName.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'technician';
  return `tickover-unsent-${who}-${createdAt.slice(0, 19).replace(/[:T]/g, '-')}.json`;
}
