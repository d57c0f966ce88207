import nodemailer, { type Transporter } from "nodemailer";

/**
 * An SMTP transport from SMTP_HOST / SMTP_PORT / SMTP_USER / SMTP_PASSWORD / SMTP_SECURE.
 * On loopback (the local sink) TLS is not attempted.
 * @example await smtpTransport().sendMail({ from, to, subject, text });
 */
export function smtpTransport(): Transporter {
  const host = process.env.SMTP_HOST ?? "127.0.0.1";
  const loopback = host === "127.0.0.1" || host === "localhost";
  return nodemailer.createTransport({
    host,
    port: Number(process.env.SMTP_PORT ?? 2525),
    secure: process.env.SMTP_SECURE === "true",
    ignoreTLS: loopback,
    auth: process.env.SMTP_USER ? { user: process.env.SMTP_USER, pass: process.env.SMTP_PASSWORD ?? "" } : undefined,
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
    socketTimeout: 10_000,
  });
}

/** The From header for outgoing mail. */
export function mailFrom(): string {
  return process.env.SMTP_FROM ?? "Sievewright <no-reply@sievewright.test>";
}
