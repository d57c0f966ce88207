import nodemailer, { type Transporter } from "nodemailer";
import { readEnv } from "@/lib/env";

/**
 * An SMTP transport from SMTP_HOST / SMTP_PORT / SMTP_USER / SMTP_PASSWORD / SMTP_SECURE.
 * On loopback (the local sink) TLS is not attempted. Connection, greeting and socket-idle time-outs (ms) come from
 * SMTP_CONNECT_TIMEOUT_MS (5 000), SMTP_GREETING_TIMEOUT_MS (5 000) and SMTP_SOCKET_TIMEOUT_MS (10 000).
 * @example await smtpTransport().sendMail({ from, to, subject, text });
 */
export function smtpTransport(): Transporter {
  const env = readEnv();
  const host = env.SMTP_HOST;
  const loopback = host === "127.0.0.1" || host === "localhost";
  return nodemailer.createTransport({
    host,
    port: env.SMTP_PORT,
    secure: env.SMTP_SECURE,
    ignoreTLS: loopback,
    auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASSWORD ?? "" } : undefined,
    connectionTimeout: env.SMTP_CONNECT_TIMEOUT_MS,
    greetingTimeout: env.SMTP_GREETING_TIMEOUT_MS,
    socketTimeout: env.SMTP_SOCKET_TIMEOUT_MS,
  });
}

/** The From header for outgoing mail. */
export function mailFrom(): string {
  return readEnv().SMTP_FROM;
}
