import nodemailer, { type Transporter } from 'nodemailer';

export interface MailAttachment {
  filename: string;
  content: Buffer;
  contentType?: string;
}

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html: string;
  attachments?: MailAttachment[];
}

/** The seam for sending: an SMTP relay today, any other delivery service later. */
export interface Mailer {
  send(message: MailMessage): Promise<void>;
  close(): void;
}

/** Sends through nodemailer's SMTP transport (an `smtp://` URL or host options). */
export class SmtpMailer implements Mailer {
  private readonly transport: Transporter;

  constructor(
    target: string | { host: string; port: number; secure: false; ignoreTLS: true },
    private readonly from: string,
  ) {
    this.transport = nodemailer.createTransport(target);
  }

  async send(message: MailMessage): Promise<void> {
    await this.transport.sendMail({ from: this.from, ...message });
  }

  close(): void {
    this.transport.close();
  }
}
