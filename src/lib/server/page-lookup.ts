// Office pages with an id in their path: the record, or null for the page to answer 404, when
// the id is malformed or names nothing in the caller's business.
import { z } from 'zod';
import { HttpError } from './http';

export async function findOwn<T>(id: string | undefined, load: (id: string) => Promise<T>): Promise<T | null> {
  if (!z.uuid().safeParse(id).success) return null;
  try {
    return await load(id!);
  } catch (error) {
    if (error instanceof HttpError && error.status === 404) return null;
    throw error;
  }
}
