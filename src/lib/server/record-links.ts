// Signed, expiring links to a visit's service record for a customer without an account.
// The URL token is `<link id>.<expiry>.<signature>`: the HMAC-SHA256 (server secret) of the id and
// expiry, so a token cannot be forged or have its expiry stretched. The row in record_links lets
// the office withdraw a link; every request and action checks signature, expiry and row.
import { createHmac, timingSafeEqual } from 'node:crypto';
import { and, eq, sql } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { recordLinks } from '../../db/schema';
import { appBaseUrl } from './config';
import { recordLinkDays, recordLinkSecret } from './follow-up-config';
import { HttpError } from './http';

const TOKEN_PATTERN = /^([0-9a-f]{32})\.([0-9a-z]{1,10})\.([A-Za-z0-9_-]{43})$/;

function signature(linkId: string, expiresAtSeconds: number, secret: string): string {
  return createHmac('sha256', secret).update(`record-link:v1:${linkId}:${expiresAtSeconds}`).digest('base64url');
}

export function signRecordToken(linkId: string, expiresAt: Date, secret = recordLinkSecret()): string {
  const seconds = Math.floor(expiresAt.getTime() / 1000);
  return `${linkId.replace(/-/g, '')}.${seconds.toString(36)}.${signature(linkId, seconds, secret)}`;
}

export type VerifiedToken = { linkId: string; expiresAt: Date };

/** Checks the token's form, signature and expiry; says nothing about the link row. */
export function verifyRecordToken(token: string, now = new Date(), secret = recordLinkSecret()): VerifiedToken | { error: string } {
  const match = TOKEN_PATTERN.exec(token);
  if (!match) return { error: 'This link is not complete. Copy the whole link from the e-mail.' };
  const hex = match[1]!;
  const linkId = `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
  const seconds = parseInt(match[2]!, 36);
  const expected = Buffer.from(signature(linkId, seconds, secret));
  const given = Buffer.from(match[3]!);
  if (expected.length !== given.length || !timingSafeEqual(expected, given)) {
    return { error: 'This link is not valid. Copy the whole link from the e-mail, or ask the business for a new one.' };
  }
  const expiresAt = new Date(seconds * 1000);
  if (expiresAt.getTime() <= now.getTime()) {
    return { error: 'This link has expired. Ask the business to send you a new one.' };
  }
  return { linkId, expiresAt };
}

export function recordUrl(token: string): string {
  return `${appBaseUrl()}/record/${token}`;
}

export async function createRecordLink(
  db: Executor,
  input: { organisationId: string; visitId: string; createdBy: string | null; now?: Date },
) {
  const now = input.now ?? new Date();
  // Whole seconds: the token carries the expiry in seconds and must match the row exactly.
  const expiresAt = new Date(Math.floor((now.getTime() + recordLinkDays() * 86_400_000) / 1000) * 1000);
  const [link] = await db
    .insert(recordLinks)
    .values({ organisationId: input.organisationId, visitId: input.visitId, expiresAt, createdBy: input.createdBy })
    .returning();
  const token = signRecordToken(link!.id, expiresAt);
  return { link: link!, token, url: recordUrl(token) };
}

export type ResolvedLink = { linkId: string; organisationId: string; visitId: string; expiresAt: Date };

/**
 * The link a customer's token names, or an HttpError a customer can act on (404 for anything
 * unknown or withdrawn, 410 for expired), so a guessed token learns nothing.
 */
export async function resolveRecordToken(db: Executor, token: string, { touch = false } = {}): Promise<ResolvedLink> {
  const verified = verifyRecordToken(token);
  if ('error' in verified) {
    throw new HttpError(/expired/.test(verified.error) ? 410 : 404, verified.error);
  }
  const [row] = await db.select().from(recordLinks).where(eq(recordLinks.id, verified.linkId));
  if (!row || row.revokedAt) {
    throw new HttpError(404, 'This link is no longer available. Ask the business to send you a new one.');
  }
  if (Math.floor(row.expiresAt.getTime() / 1000) !== Math.floor(verified.expiresAt.getTime() / 1000)) {
    throw new HttpError(404, 'This link is not valid. Ask the business to send you a new one.');
  }
  if (touch) {
    await db
      .update(recordLinks)
      .set({ lastOpenedAt: sql`now()`, firstOpenedAt: sql`coalesce(${recordLinks.firstOpenedAt}, now())` })
      .where(eq(recordLinks.id, row.id));
  }
  return { linkId: row.id, organisationId: row.organisationId, visitId: row.visitId, expiresAt: row.expiresAt };
}

export async function revokeRecordLinks(db: Executor, organisationId: string, visitId: string) {
  return db
    .update(recordLinks)
    .set({ revokedAt: sql`now()` })
    .where(and(eq(recordLinks.organisationId, organisationId), eq(recordLinks.visitId, visitId), sql`${recordLinks.revokedAt} is null`))
    .returning({ id: recordLinks.id });
}
