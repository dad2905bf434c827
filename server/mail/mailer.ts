import nodemailer, { type Transporter } from 'nodemailer';
import type { DataSource } from 'typeorm';
import type { Logger } from 'pino';
import type { Config } from '../config.js';
import { MailLog } from '../entities/index.js';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
  /** Short name of the template, for the mail log (`invite`, `reset`, `signoff-request`, …). */
  template: string;
  studioId?: number | null;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
}

/** Sends through SMTP (the local fake in development and tests) and records every attempt. */
export function createMailer(config: Config['smtp'], ds: DataSource, log: Logger): Mailer {
  const transport: Transporter = nodemailer.createTransport({
    host: config.host,
    port: config.port,
    secure: false,
    ignoreTLS: true,
    connectionTimeout: 5000,
  });
  return {
    async send(mail) {
      let error: string | null = null;
      try {
        await transport.sendMail({ from: config.from, to: mail.to, subject: mail.subject, text: mail.text, html: mail.html });
      } catch (err) {
        error = (err as Error).message.slice(0, 500);
        log.error({ err, to: mail.to, template: mail.template }, 'mail not sent');
      }
      await ds.getRepository(MailLog).insert({
        studioId: mail.studioId ?? null,
        toAddress: mail.to,
        template: mail.template,
        subject: mail.subject.slice(0, 300),
        status: error ? 'failed' : 'sent',
        error,
      });
      if (error) throw new Error(`The e-mail to ${mail.to} could not be sent: ${error}`);
    },
  };
}
