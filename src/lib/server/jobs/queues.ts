// The job queues, in one place so the app (which sends) and the worker (which works) agree.
import type PgBoss from 'pg-boss';
import { MAIL_RETRY_LIMIT, mailRetryDelaySeconds } from '../follow-up-config';

export const QUEUES = {
  sendMail: 'send-mail',
  sweepMail: 'sweep-mail',
  scanReminders: 'scan-reminders',
} as const;

export type SendMailJob = { messageId: string };

export function queueDefinitions(): PgBoss.Queue[] {
  return [
    // A refused or unreachable mail server is retried with growing gaps (retryBackoff doubles the
    // delay): 30 s, 1 min, 2 min... by default, six times, before the message is marked failed.
    { name: QUEUES.sendMail, retryLimit: MAIL_RETRY_LIMIT, retryDelay: mailRetryDelaySeconds(), retryBackoff: true, expireInSeconds: 120 },
    { name: QUEUES.sweepMail, retryLimit: 0, expireInSeconds: 120 },
    { name: QUEUES.scanReminders, retryLimit: 2, retryDelay: 300, retryBackoff: true, expireInSeconds: 900 },
  ];
}
