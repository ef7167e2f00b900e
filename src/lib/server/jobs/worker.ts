// The worker process (scripts/worker.ts, started by `npm start` and `npm test`): sends queued
// e-mail, sweeps stuck messages, and scans for due service reminders every morning.
import { getBoss, stopBoss } from './boss';
import { QUEUES, type SendMailJob } from './queues';
import { jobPollSeconds } from '../follow-up-config';
import { deliverMessage, sweepMessages } from '../mail/deliver';
import { closeMailTransport } from '../mail/transport';
import { scanAllOrganisations } from '../reminders';
import { closeDb } from '../../../db/client';

// Reminders go out in the morning, business time, when the office can take the calls they bring.
const REMINDER_CRON = '0 7 * * *';
const REMINDER_TIME_ZONE = process.env.REMINDER_TIME_ZONE ?? 'Europe/London';

export async function runWorker() {
  const boss = await getBoss('worker');
  const pollingIntervalSeconds = jobPollSeconds();
  await boss.work<SendMailJob>(QUEUES.sendMail, { includeMetadata: true, pollingIntervalSeconds }, async (jobs) => {
    for (const job of jobs) {
      const outcome = await deliverMessage(job.data.messageId, { lastAttempt: job.retryCount >= job.retryLimit });
      console.log(`[worker] message ${job.data.messageId}: ${outcome}`);
    }
  });
  await boss.work(QUEUES.sweepMail, { pollingIntervalSeconds }, async () => {
    const { uncertain, waiting } = await sweepMessages();
    if (uncertain > 0) console.warn(`[worker] ${uncertain} message(s) marked uncertain after a stopped send`);
    for (const messageId of waiting) await boss.send(QUEUES.sendMail, { messageId } satisfies SendMailJob, { singletonKey: messageId });
  });
  await boss.work(QUEUES.scanReminders, { pollingIntervalSeconds }, async () => {
    const results = await scanAllOrganisations();
    const count = results.reduce((n, r) => n + r.reminded.length, 0);
    console.log(`[worker] reminder scan: ${count} reminder(s) queued`);
  });
  await boss.schedule(QUEUES.sweepMail, '* * * * *');
  await boss.schedule(QUEUES.scanReminders, REMINDER_CRON, {}, { tz: REMINDER_TIME_ZONE });
  console.log('[worker] ready');

  const stop = async () => {
    await stopBoss();
    closeMailTransport();
    await closeDb();
    process.exit(0);
  };
  process.once('SIGTERM', stop);
  process.once('SIGINT', stop);
}
