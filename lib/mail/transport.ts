import nodemailer, { type Transporter } from "nodemailer";

/**
 * An SMTP transport from SMTP_HOST / SMTP_PORT / SMTP_USER / SMTP_PASSWORD / SMTP_SECURE.
 * On loopback (the local sink) TLS is not attempted. Connection, greeting and socket-idle time-outs (ms) come from
 * SMTP_CONNECT_TIMEOUT_MS (5 000), SMTP_GREETING_TIMEOUT_MS (5 000) and SMTP_SOCKET_TIMEOUT_MS (10 000).
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
    connectionTimeout: Number(process.env.SMTP_CONNECT_TIMEOUT_MS ?? 5_000),
    greetingTimeout: Number(process.env.SMTP_GREETING_TIMEOUT_MS ?? 5_000),
    socketTimeout: Number(process.env.SMTP_SOCKET_TIMEOUT_MS ?? 10_000),
  });
}

/** The From header for outgoing mail. */
export function mailFrom(): string {
  return process.env.SMTP_FROM ?? "Sievewright <no-reply@sievewright.test>";
}
