// Path parameters of office routes. An id that is not a UUID cannot name anything we keep, so
// it gets the same 404 as an id that names nothing in the caller's business.
import { z } from 'zod';
import type { APIContext } from 'astro';
import { HttpError } from './http';

export function idParam(context: APIContext, name = 'id', what = 'record'): string {
  const parsed = z.uuid().safeParse(context.params[name]);
  if (!parsed.success) throw new HttpError(404, `No such ${what} in this business.`);
  return parsed.data;
}
