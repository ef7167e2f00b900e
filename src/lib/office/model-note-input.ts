// A known weak spot of a make and model (optionally one engine), shown on every matching visit.
import { z } from 'zod';

export const modelNoteInput = z.object({
  make: z.string().trim().min(1, 'needs a make').max(60),
  model: z.string().trim().min(1, 'needs a model').max(60),
  // Empty: every engine of that make and model.
  engine: z.string().trim().max(60),
  title: z.string().trim().min(1, 'needs a title').max(160),
  body: z.string().trim().min(1, 'say what to look for').max(4000),
});

export type ModelNoteInput = z.output<typeof modelNoteInput>;

/** Whether a note applies to a vehicle: same make and model (ignoring case), and engine unless blank. */
export function noteMatches(
  note: { make: string; model: string; engine: string },
  vehicle: { make: string; model: string; engine: string },
): boolean {
  const same = (a: string, b: string) => a.trim().toLowerCase() === b.trim().toLowerCase();
  return same(note.make, vehicle.make) && same(note.model, vehicle.model) && (note.engine.trim() === '' || same(note.engine, vehicle.engine));
}
