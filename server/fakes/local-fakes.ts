/**
 * Starts the local stand-ins that the configuration points at: the payment service when the
 * stripe SDK is aimed at a loopback address, and the mail server when SMTP is. Pointing the
 * configuration at the hosted services (see README) starts neither, with no code change.
 */
import { isLoopback, type Config } from '../config.ts';
import { startPaymentFake, type PaymentFake } from './payment-fake.ts';
import { startSmtpFake, type SmtpFake } from './smtp-fake.ts';

export interface LocalFakes {
  payment: PaymentFake | null;
  mail: SmtpFake | null;
  close(): Promise<void>;
}

export async function startLocalFakes(config: Config, webhookUrl: string): Promise<LocalFakes> {
  let payment: PaymentFake | null = null;
  let mail: SmtpFake | null = null;
  try {
    if (isLoopback(config.STRIPE_API_HOST) && config.STRIPE_API_PROTOCOL === 'http') {
      payment = await startPaymentFake({
        host: config.STRIPE_API_HOST,
        port: config.STRIPE_API_PORT,
        apiKey: config.STRIPE_SECRET_KEY,
        webhookSecret: config.STRIPE_WEBHOOK_SECRET,
        webhookUrl,
      });
    }
    if (isLoopback(config.SMTP_HOST)) {
      const outbox = config.DEV_OUTBOX_URL ? new URL(config.DEV_OUTBOX_URL) : null;
      const httpPort = outbox && isLoopback(outbox.hostname) ? Number(outbox.port || 80) : 0;
      mail = await startSmtpFake({ host: config.SMTP_HOST, smtpPort: config.SMTP_PORT, httpPort });
    }
  } catch (error) {
    await payment?.close();
    throw error;
  }
  return {
    payment,
    mail,
    async close() {
      await Promise.all([payment?.close(), mail?.close()]);
    },
  };
}

/** Both stand-ins on free ports, and the configuration that points the app at them (tests). */
export async function startFakesOnFreePorts(secrets: { apiKey: string; webhookSecret: string }) {
  const payment = await startPaymentFake({ ...secrets, port: 0 });
  const mail = await startSmtpFake({ smtpPort: 0, httpPort: 0 });
  const config: Partial<Config> = {
    STRIPE_API_HOST: payment.host,
    STRIPE_API_PORT: payment.port,
    STRIPE_API_PROTOCOL: 'http',
    STRIPE_SECRET_KEY: secrets.apiKey,
    STRIPE_WEBHOOK_SECRET: secrets.webhookSecret,
    SMTP_HOST: mail.host,
    SMTP_PORT: mail.smtpPort,
    DEV_OUTBOX_URL: mail.outboxUrl,
  };
  return {
    payment,
    mail,
    config,
    async close() {
      await Promise.all([payment.close(), mail.close()]);
    },
  };
}

export type FakesOnFreePorts = Awaited<ReturnType<typeof startFakesOnFreePorts>>;
