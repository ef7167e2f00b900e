// The one way endpoints answer: JSON bodies, errors with a message a person can act on.
import { ZodError, type ZodType } from 'zod';
import type { APIContext } from 'astro';
import type { UserRole } from '../../db/schema';
import type { SessionUser } from '../auth';

export class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
  }
}

export function json(body: unknown, status = 200, headers: Record<string, string> = {}): Response {
  return new Response(JSON.stringify(body), {
    status,
    headers: { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store', ...headers },
  });
}

export function errorResponse(status: number, message: string, details?: unknown): Response {
  return json(details === undefined ? { error: message } : { error: message, details }, status);
}

/** Turns a ZodError into "field: problem" lines a person can read. */
export function describeZodError(error: ZodError): string[] {
  return error.issues.map((issue) => {
    const path = issue.path.length ? issue.path.join('.') : 'body';
    return `${path}: ${issue.message}`;
  });
}

type Handler = (context: APIContext) => Promise<Response> | Response;

/** Wraps an endpoint so thrown HttpErrors and validation errors become clear JSON answers. */
export function endpoint(handler: Handler): Handler {
  return async (context) => {
    try {
      return await handler(context);
    } catch (error) {
      if (error instanceof HttpError) return errorResponse(error.status, error.message, error.details);
      if (error instanceof ZodError) {
        return errorResponse(400, 'The request is not valid.', describeZodError(error));
      }
      console.error(`[api] ${context.request.method} ${context.url.pathname} failed`, error);
      return errorResponse(500, 'Something went wrong on the server. Nothing was changed; try again.');
    }
  };
}

/** The signed-in user, or a 401. */
export function requireUser(context: APIContext): SessionUser {
  const user = context.locals.user;
  if (!user) throw new HttpError(401, 'Sign in first.');
  return user;
}

/** The signed-in user if their role is one of `roles`; otherwise 401 or 403. */
export function requireRole(context: APIContext, roles: readonly UserRole[]): SessionUser {
  const user = requireUser(context);
  if (!roles.includes(user.role)) {
    throw new HttpError(403, `This needs the ${roles.join(' or ')} role; you are signed in as ${user.role}.`);
  }
  return user;
}

export const OFFICE_ROLES = ['office', 'owner'] as const satisfies readonly UserRole[];

/** Parses a JSON body with a zod schema; malformed JSON or a bad shape is a 400. */
export async function readJson<T>(request: Request, schema: ZodType<T>, maxBytes = 1_000_000): Promise<T> {
  const type = request.headers.get('content-type') ?? '';
  if (!type.includes('application/json')) {
    throw new HttpError(415, 'Send the body as JSON (content-type: application/json).');
  }
  const text = new TextDecoder().decode(await readBodyBytes(request, maxBytes));
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch {
    throw new HttpError(400, 'The body is not valid JSON.');
  }
  return schema.parse(data);
}

/** Reads the body, stopping with a 413 as soon as it passes `maxBytes` (before holding it all). */
export async function readBodyBytes(request: Request, maxBytes: number): Promise<Uint8Array> {
  const tooLarge = () => new HttpError(413, `The body is larger than ${maxBytes} bytes.`);
  if (Number(request.headers.get('content-length') ?? 0) > maxBytes) throw tooLarge();
  if (!request.body) return new Uint8Array();
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > maxBytes) {
      await reader.cancel();
      throw tooLarge();
    }
    chunks.push(value);
  }
  const bytes = new Uint8Array(size);
  let offset = 0;
  for (const chunk of chunks) {
    bytes.set(chunk, offset);
    offset += chunk.byteLength;
  }
  return bytes;
}

/** Parses URL search parameters with a zod schema. */
export function readQuery<T>(url: URL, schema: ZodType<T>): T {
  return schema.parse(Object.fromEntries(url.searchParams));
}
