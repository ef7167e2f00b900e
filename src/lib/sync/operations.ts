// The operation a device sends for every change it records: the contract between the phone's
// outbox and POST /api/sync/push. Validated with zod on both sides.
import { z } from 'zod';
import { isStamp, type Stamp } from './clock';

const stamp = z.string().refine(isStamp, 'is not a clock stamp').transform((s) => s as Stamp);
const id = z.uuid();
const text = (max: number) => z.string().trim().max(max, `must be at most ${max} characters`);

export const CHECK_STATES = ['done', 'skipped', 'not_yet'] as const;
export const SEVERITIES = ['ok', 'watch', 'soon', 'now'] as const;
export type Severity = (typeof SEVERITIES)[number];
export const SEVERITY_RANK: Record<Severity, number> = { ok: 0, watch: 1, soon: 2, now: 3 };

// Readings are bounded so that a fat-fingered 1e308 cannot reach the database or a report.
const READING_LIMIT = 1e7;
// A drawn signature as SVG; a long, careful signature is a few tens of kilobytes.
const SIGNATURE_LIMIT = 200_000;

const checkPayload = z.object({ itemId: id, state: z.enum(CHECK_STATES) });

const readingPayload = z
  .object({
    itemId: id,
    value: z.number().min(-READING_LIMIT).max(READING_LIMIT).nullable(),
    textValue: text(40).min(1).nullable(),
    unit: text(32).min(1),
  })
  .refine((r) => (r.value === null) !== (r.textValue === null), 'give either a number or a text value');

const findingPayload = z.object({
  findingId: id,
  itemId: id.nullable(),
  title: text(200).min(1, 'needs a title'),
  detail: text(4000),
  severity: z.enum(SEVERITIES),
  // Only the office may lower a severity, and only by saying so (PRODUCT.md, merge rules).
  downgrade: z.boolean().default(false),
});

const notePayload = z.object({ noteId: id, body: text(4000).min(1, 'is empty') });

const photoAddPayload = z.object({
  photoId: id,
  findingId: id.nullable(),
  itemId: id.nullable(),
  caption: text(200),
  sha256: z.string().regex(/^[0-9a-f]{64}$/, 'must be a lower-case hex SHA-256'),
  contentType: z.enum(['image/jpeg', 'image/png', 'image/webp']),
  sizeBytes: z.number().int().positive(),
  width: z.number().int().positive().nullable(),
  height: z.number().int().positive().nullable(),
});

const photoRemovePayload = z.object({ photoId: id });

const partLinePayload = z.object({
  lineId: id,
  itemId: id.nullable(),
  partId: id.nullable(),
  partNumber: text(60).min(1),
  description: text(200),
  quantity: z.number().positive().max(1000),
  unit: text(32).min(1),
  removed: z.boolean(),
});

// A signature is a drawing: the phone's signature pad writes an <svg> of paths, dots and lines.
// Office and phone show it only as an <img>, where an SVG runs nothing; still, a signature that
// holds a script, a link or an image to fetch, an event handler or an entity is not a signature,
// and nothing that could act once shown some other way is kept.
const DRAWING_ELEMENTS = new Set(['svg', 'g', 'path', 'circle', 'ellipse', 'line', 'polyline', 'polygon', 'rect', 'title', 'desc']);

export function isPlainDrawing(svg: string): boolean {
  if (/<[!?]/.test(svg)) return false;
  if (/[\s"'](on[a-z]+|href|xlink:href|style|src)\s*=/i.test(svg)) return false;
  for (const tag of svg.matchAll(/<\/?\s*([A-Za-z][\w:.-]*)/g)) {
    if (!DRAWING_ELEMENTS.has(tag[1]!.toLowerCase())) return false;
  }
  return true;
}

const signatureSvg = z
  .string()
  .min(20)
  .max(SIGNATURE_LIMIT)
  .startsWith('<svg', 'must be an SVG document')
  .refine(isPlainDrawing, 'must be a drawing of paths, dots and lines only (no scripts, links, images or styles)');

const signOffPayload = z.object({
  signOffId: id,
  odometer: z.number().int().min(0).max(5_000_000),
  odometerUnit: z.enum(['km', '[mi_i]']),
  customerName: text(120).min(1, 'needs the customer’s name'),
  signatureSvg,
  declaration: text(2000).min(1),
  signedAt: z.iso.datetime(),
});

const envelope = {
  opId: id,
  visitId: id,
  deviceId: z.string().regex(/^[A-Za-z0-9_-]{1,64}$/, 'must be 1-64 letters, digits, - or _'),
  stamp,
  // The stamp of the value this device last saw for the same thing (null: it saw none).
  seenStamp: stamp.nullable(),
};

export const operationSchema = z.discriminatedUnion('kind', [
  z.object({ ...envelope, kind: z.literal('check'), payload: checkPayload }),
  z.object({ ...envelope, kind: z.literal('reading'), payload: readingPayload }),
  z.object({ ...envelope, kind: z.literal('finding'), payload: findingPayload }),
  z.object({ ...envelope, kind: z.literal('note'), payload: notePayload }),
  z.object({ ...envelope, kind: z.literal('photo.add'), payload: photoAddPayload }),
  z.object({ ...envelope, kind: z.literal('photo.remove'), payload: photoRemovePayload }),
  z.object({ ...envelope, kind: z.literal('part_line'), payload: partLinePayload }),
  z.object({ ...envelope, kind: z.literal('sign_off'), payload: signOffPayload }),
]);

export type Operation = z.infer<typeof operationSchema>;
export type OperationKind = Operation['kind'];
export type OperationOf<K extends OperationKind> = Extract<Operation, { kind: K }>;
export const OPERATION_KINDS = operationSchema.options.map((o) => o.shape.kind.value) as OperationKind[];

/** The id of the thing an operation changes, within its visit. */
export function entityIdOf(op: Operation): string {
  switch (op.kind) {
    case 'check':
    case 'reading':
      return op.payload.itemId;
    case 'finding':
      return op.payload.findingId;
    case 'note':
      return op.payload.noteId;
    case 'photo.add':
    case 'photo.remove':
      return op.payload.photoId;
    case 'part_line':
      return op.payload.lineId;
    case 'sign_off':
      return op.visitId;
  }
}

/** What a push answers for each operation. */
export const OUTCOMES = ['applied', 'duplicate', 'superseded', 'conflict', 'locked', 'rejected'] as const;
export type Outcome = (typeof OUTCOMES)[number];
export type OperationResult = { opId: string; outcome: Outcome; reason?: string };
