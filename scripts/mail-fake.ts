import { createFakeMailServer } from '../lib/mail/fake/server';

const smtpPort = Number(process.env.MAIL_FAKE_SMTP_PORT ?? 2525);
const httpPort = Number(process.env.MAIL_FAKE_HTTP_PORT ?? 2580);
const server = await createFakeMailServer({ smtpPort, httpPort });
console.log(`mail fake listening: smtp://127.0.0.1:${server.smtpPort}, outbox ${server.httpUrl}/messages`);

for (const signal of ['SIGTERM', 'SIGINT'] as const) {
  process.on(signal, () => {
    void server.close().then(() => process.exit(0));
  });
}
