import nodemailer from 'nodemailer';
import type { OutboxMessage } from './outbox-message.entity';

export interface MailTransport {
  send(message: OutboxMessage): Promise<void>;
  close(): void;
}

export function smtpTransport(host: string, port: number, from: string): MailTransport {
  const transport = nodemailer.createTransport({ host, port, secure: false, ignoreTLS: true, connectionTimeout: 5000, greetingTimeout: 5000, socketTimeout: 10000 });
  return {
    async send(m) {
      await transport.sendMail({
        from,
        to: m.toAddress,
        subject: m.subject,
        text: m.textBody,
        html: m.htmlBody,
        headers: { 'X-Femtoslot-Message-Id': m.id },
        attachments: m.attachments.map((a) => ({ filename: a.filename, contentType: a.contentType, content: Buffer.from(a.content, 'base64') })),
      });
    },
    close: () => transport.close(),
  };
}
