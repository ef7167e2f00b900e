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

