// Configuration of the follow-up services (record links, mail, payments, job queue) from the
// environment. Every variable is listed in README.md under Configuration; `npm start` and
// `npm test` point them at the local fakes.

function numberFrom(name: string, fallback: number): number {
  const raw = process.env[name];
  if (raw === undefined || raw === '') return fallback;
  const value = Number(raw);
  if (!Number.isFinite(value) || value < 0) throw new Error(`${name} must be a non-negative number, not "${raw}".`);
  return value;
}

export function recordLinkSecret(): string {
  const secret = process.env.RECORD_LINK_SECRET;
  if (!secret || secret.length < 32) {
    throw new Error('RECORD_LINK_SECRET must be set to at least 32 random characters (npm start makes one).');
  }
  return secret;
}

/** How long a customer's link to a service record works. Long enough to find it again at the next service. */
export function recordLinkDays(): number {
  return numberFrom('RECORD_LINK_DAYS', 90);
}

export function smtpUrl(): string {
  const url = process.env.SMTP_URL;
  if (!url) throw new Error('SMTP_URL is not set: e-mail cannot be sent. `npm start` starts a local mail fake and sets it.');
  return url;
}

/** The envelope sender; replies go to the business's own address. */
export function mailFrom(): string {
  return process.env.MAIL_FROM ?? 'no-reply@tickover.example';
}

/** First retry delay; pg-boss doubles it on each further retry (retryBackoff). */
export function mailRetryDelaySeconds(): number {
  return numberFrom('MAIL_RETRY_DELAY_SECONDS', 30);
}

export const MAIL_RETRY_LIMIT = 6;

export function jobPollSeconds(): number {
  // pg-boss refuses intervals under half a second.
  return Math.max(0.5, numberFrom('JOB_POLL_SECONDS', 2));
}

export type StripeSettings = {
  secretKey: string;
  webhookSecret: string;
  host?: string;
  port?: number;
  protocol?: 'http' | 'https';
};

export function stripeSettings(): StripeSettings {
  const secretKey = process.env.STRIPE_SECRET_KEY;
  const webhookSecret = process.env.STRIPE_WEBHOOK_SECRET;
  if (!secretKey || !webhookSecret) {
    throw new Error('STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET must be set for card payments (npm start uses a local fake).');
  }
  const protocol = process.env.STRIPE_API_PROTOCOL;
  return {
    secretKey,
    webhookSecret,
    host: process.env.STRIPE_API_HOST || undefined,
    port: process.env.STRIPE_API_PORT ? Number(process.env.STRIPE_API_PORT) : undefined,
    protocol: protocol === 'http' || protocol === 'https' ? protocol : undefined,
  };
}

/** Days a customer has to pay an invoice; common practice for small trade businesses is 14 or 30. */
export function invoicePaymentDays(): number {
  return numberFrom('INVOICE_PAYMENT_DAYS', 14);
}
