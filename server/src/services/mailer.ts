import nodemailer, { type Transporter } from 'nodemailer';

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html?: string;
  attachments?: { filename: string; content: Buffer; contentType: string }[];
}

/** E-mail goes out through SMTP; locally and in tests that SMTP server is the fake in server/src/fakes. */
export interface Mailer {
  send(message: MailMessage): Promise<void>;
  close(): void;
}

export function createSmtpMailer(opts: { host: string; port: number; from: string }): Mailer {
  const transport: Transporter = nodemailer.createTransport({
    host: opts.host,
    port: opts.port,
    secure: false,
    ignoreTLS: true,
    connectionTimeout: 5000,
  });
  return {
    async send(m) {
      await transport.sendMail({
        from: opts.from,
        to: m.to,
        subject: m.subject,
        text: m.text,
        html: m.html,
        attachments: m.attachments,
      });
    },
    close() {
      transport.close();
    },
  };
}
