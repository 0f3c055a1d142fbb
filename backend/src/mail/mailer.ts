// Sends mail through SMTP with nodemailer (the local fake SMTP server in development and tests).
import nodemailer from 'nodemailer';
import type { AppConfig } from '../config';

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html: string;
}

export interface Mailer {
  send(message: MailMessage): Promise<void>;
  close(): void;
}

export function createMailer(smtp: AppConfig['smtp']): Mailer {
  const transport = nodemailer.createTransport({
    host: smtp.host,
    port: smtp.port,
    secure: false,
    ignoreTLS: true,
    connectionTimeout: 5000,
  });
  return {
    async send(message) {
      await transport.sendMail({ from: smtp.from, ...message });
    },
    close() {
      transport.close();
    },
  };
}
