// The one SMTP transport of a process (nodemailer), made on first use.
import nodemailer, { type Transporter } from 'nodemailer';
import { smtpUrl } from '../follow-up-config';

let transport: Transporter | undefined;

export function mailTransport(): Transporter {
  const url = new URL(smtpUrl());
  transport ??= nodemailer.createTransport({
    host: url.hostname,
    port: Number(url.port || (url.protocol === 'smtps:' ? 465 : 587)),
    secure: url.protocol === 'smtps:',
    auth: url.username ? { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) } : undefined,
    // A mail server that hangs must not hold a job past its expiry.
    connectionTimeout: 15_000,
    greetingTimeout: 15_000,
    socketTimeout: 30_000,
  });
  return transport;
}

export function closeMailTransport() {
  transport?.close();
  transport = undefined;
}
