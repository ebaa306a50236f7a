import nodemailer, { type Transporter } from 'nodemailer';
import type { Config } from '../config';

/** A message Seamline sends (notifications arrive with later features). */
export interface OutgoingMail {
  to: string | string[];
  subject: string;
  text: string;
  html?: string;
}

/** Sends mail through the configured SMTP server (the loopback mail fake in development and tests). */
export class Mailer {
  private readonly transport: Transporter;

  constructor(private readonly config: Config['mail']) {
    this.transport = nodemailer.createTransport({
      host: config.host,
      port: config.port,
      secure: false,
      // The loopback fake offers no TLS; a real relay is configured by URL and certificate.
      ignoreTLS: config.host === '127.0.0.1' || config.host === 'localhost' || config.host === '::1',
      connectionTimeout: 5000,
    });
  }

  /** Sends one message; resolves with the SMTP message id. */
  async send(mail: OutgoingMail): Promise<string> {
    const info = await this.transport.sendMail({ from: this.config.from, ...mail });
    return info.messageId;
  }

  close(): void {
    this.transport.close();
  }
}
