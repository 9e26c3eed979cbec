import nodemailer from 'nodemailer';

export interface MailTransport {
  send(mail: { to: string; subject: string; text: string }): Promise<void>;
  close(): void;
}

/** nodemailer over SMTP: the real server in production, the in-process fake locally. */
export function smtpTransport(smtpUrl: string, from: string): MailTransport {
  const url = new URL(smtpUrl);
  const transporter = nodemailer.createTransport({
    host: url.hostname,
    port: Number(url.port || 25),
    secure: url.protocol === 'smtps:',
    ignoreTLS: url.searchParams.get('ignoreTLS') === 'true',
    auth: url.username ? { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) } : undefined,
    connectionTimeout: 5000,
  });
  return {
    async send(mail) {
      await transporter.sendMail({ from, ...mail });
    },
    close: () => transporter.close(),
  };
}
