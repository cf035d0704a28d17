// Starts and stops everything mail needs in one app server: the local SMTP
// fake (only without SMTP_URL), the transport, the outbox worker, the effects
// sink and, when SCHEDULER is on, the scheduler with the reminder jobs.
import type { AppDeps } from '../app-deps';
import { setEffectSink, type EffectSink } from '../services/effects';
import { createMailTransport } from './transport';
import { startSmtpFake, type SmtpFake } from './smtp-fake';
import { createOutboxWorker, type OutboxWorker } from './outbox-worker';
import { mailEffectSink, registerOutboxWorker } from './mail-effects';
import { SCHEDULED_JOBS, createScheduler, type Scheduler } from '../jobs';
import { sweepEvidenceTemp } from '../services/evidence.service';

export interface MailRuntime {
  /** The local fake, when no SMTP_URL is configured. */
  smtp: SmtpFake | null;
  worker: OutboxWorker;
  scheduler: Scheduler;
  stop(): Promise<void>;
}

export interface StartMailOptions {
  /** Run the scheduler on its interval (default: config SCHEDULER). Tests tick it by hand. */
  scheduler?: boolean;
  /** How often the worker looks for due retries (ms). */
  pollMs?: number;
  /** Port for the SMTP fake (0: any free port). */
  smtpPort?: number;
}

// The effects sink is process-wide; several app servers in one process (tests) share it until the last one stops.
let sinkUsers = 0;
let sinkBefore: EffectSink | null = null;

function installSink() {
  if (sinkUsers === 0) sinkBefore = setEffectSink(mailEffectSink);
  sinkUsers += 1;
}

function uninstallSink() {
  sinkUsers -= 1;
  if (sinkUsers === 0 && sinkBefore) {
    setEffectSink(sinkBefore);
    sinkBefore = null;
  }
}

export async function startMail(deps: AppDeps, options: StartMailOptions = {}): Promise<MailRuntime> {
  const { config, logger, sequelize } = deps;
  const smtp = config.mail.smtpUrl ? null : await startSmtpFake({ port: options.smtpPort ?? 0, logger });
  if (smtp) logger.info(`No SMTP_URL: catching mail on ${smtp.url}; the admin mailbox page shows it`);
  const transport = createMailTransport(config.mail.smtpUrl ?? smtp!.url);
  const worker = createOutboxWorker(deps, transport);
  worker.start(options.pollMs ?? 10_000);
  registerOutboxWorker(sequelize, worker);
  installSink();
  const scheduler = createScheduler(deps, SCHEDULED_JOBS, { onRan: () => worker.kick() });
  if (options.scheduler ?? config.scheduler.enabled) scheduler.start(config.scheduler.intervalSeconds);
  worker.kick();
  // Finish evidence moves a crash interrupted before the server takes requests.
  void sweepEvidenceTemp(deps).catch((error) => logger.error('Evidence sweep at start-up failed', error));
  return {
    smtp,
    worker,
    scheduler,
    async stop() {
      await scheduler.stop();
      await worker.stop();
      registerOutboxWorker(sequelize, null);
      uninstallSink();
      transport.close();
      await smtp?.stop();
    },
  };
}
