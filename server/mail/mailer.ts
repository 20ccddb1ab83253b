import nodemailer from 'nodemailer';
import type { Config } from '../config';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

export interface Mailer {
  /** True when messages go to the local sink (and the admin mail page can show them). */
  local: boolean;
  send(mail: OutgoingMail): Promise<void>;
}

/** nodemailer over SMTP_URL, or over the local sink on sinkPort. */
export function createMailer(config: Config, sinkPort: number | null): Mailer {
  const transport = config.SMTP_URL
    ? nodemailer.createTransport(config.SMTP_URL)
    : nodemailer.createTransport({ host: '127.0.0.1', port: sinkPort ?? config.SMTP_SINK_PORT, secure: false, ignoreTLS: true });
  return {
    local: !config.SMTP_URL,
    send: async (mail) => {
      await transport.sendMail({ from: config.MAIL_FROM, ...mail });
    },
  };
}
