/**
 * The Kilowatch server process: parses settings, connects to PostgreSQL, starts the local fake mail server when
 * MAIL_MODE=fake, serves API and built client from one Express app, and shuts down cleanly on SIGINT/SIGTERM.
 */
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { createApp } from './app';
import { createJobs } from './jobs/index';
import type { AppDeps } from './context';
import { connect } from './db/client';
import { parseEnv } from './env';
import { startFakeSmtp, type FakeSmtp } from './mail/fake-smtp';
import { createMailer } from './mail/mailer';
import { LIMITS } from '../shared/limits';

const here = path.dirname(fileURLToPath(import.meta.url));

export async function startServer(): Promise<{ url: string; close(): Promise<void> }> {
  const env = parseEnv();
  const database = connect(env.DATABASE_URL);
  let fake: FakeSmtp | null = null;
  let mailSettings;
  if (env.MAIL_MODE === 'fake') {
    fake = await startFakeSmtp(0);
    mailSettings = { host: '127.0.0.1', port: fake.port, secure: false, from: env.MAIL_FROM };
    console.log(`[mail] local fake mail server on 127.0.0.1:${fake.port} (messages stay on this machine; see the admin outbox)`);
  } else {
    mailSettings = {
      host: env.SMTP_HOST as string,
      port: env.SMTP_PORT ?? (env.SMTP_SECURE ? 465 : 587),
      secure: env.SMTP_SECURE,
      user: env.SMTP_USER,
      password: env.SMTP_PASSWORD,
      from: env.MAIL_FROM,
    };
  }
  const mailer = createMailer(mailSettings);
  const deps: AppDeps = {
    db: database.db,
    mailer,
    config: {
      sessionSecret: new TextEncoder().encode(env.SESSION_SECRET),
      sessionHours: LIMITS.sessionHours,
      cookieSecure: env.COOKIE_SECURE,
      appOrigin: env.APP_ORIGIN,
      trustProxy: env.TRUST_PROXY,
      uploadDir: env.KILOWATCH_UPLOAD_DIR,
      clientDir: path.resolve(here, '../dist/client'),
    },
    now: () => new Date(),
  };
  const jobs = createJobs(deps, env.DATABASE_URL, { onDone: (queue, result) => console.log(`[jobs] ${queue} ${JSON.stringify(result)}`) });
  await jobs.start();
  deps.jobs = jobs;
  const app = createApp(deps);
  const server = await new Promise<import('node:http').Server>((resolve) => {
    const s = app.listen(env.KILOWATCH_PORT, env.KILOWATCH_HOST, () => resolve(s));
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : env.KILOWATCH_PORT;
  const url = `http://${env.KILOWATCH_HOST}:${port}`;
  return {
    url,
    async close() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await jobs.stop();
      mailer.close();
      await fake?.close();
      await database.close();
    },
  };
}

const isMain = process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url);
if (isMain) {
  startServer()
    .then((s) => {
      console.log(`[server] Kilowatch listening on ${s.url}`);
      const stop = () => {
        console.log('[server] shutting down');
        s.close().then(() => process.exit(0));
      };
      process.on('SIGINT', stop);
      process.on('SIGTERM', stop);
    })
    .catch((err: Error) => {
      console.error(err.message);
      process.exit(1);
    });
}
