import { mkdirSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { SMTPServer } from "smtp-server";

/** A message captured by the local sink. */
export interface CapturedMail {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  raw: string;
}

function header(raw: string, name: string): string {
  const head = raw.split(/\r?\n\r?\n/)[0] ?? "";
  const unfolded = head.replace(/\r?\n[ \t]+/g, " ");
  const match = new RegExp(`^${name}:\\s*(.*)$`, "im").exec(unfolded);
  return match ? decodeWords(match[1].trim()) : "";
}

function decodeWords(value: string): string {
  // RFC 2047 §6.2: white space between adjacent encoded-words is not part of the text.
  return value.replace(/(=\?[^?]+\?[bq]\?[^?]*\?=)\s+(?==\?)/gi, "$1").replace(/=\?utf-8\?([bq])\?([^?]*)\?=/gi, (_, enc: string, text: string) =>
    enc.toLowerCase() === "b"
      ? Buffer.from(text, "base64").toString("utf8")
      : Buffer.from(text.replace(/_/g, " ").replace(/=([0-9a-f]{2})/gi, (_m, h: string) => String.fromCharCode(parseInt(h, 16))), "latin1").toString("utf8"),
  );
}

/**
 * Starts an SMTP sink on loopback that stores every message as JSON in `dir` (for development and tests only).
 * @example const sink = await startMailSink({ port: 2525, dir: ".data/mail" }); … await sink.close();
 */
export async function startMailSink(opts: { port: number; dir: string }): Promise<{ port: number; close: () => Promise<void> }> {
  mkdirSync(opts.dir, { recursive: true });
  let seq = 0;
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on("data", (c: Buffer) => chunks.push(c));
      stream.on("end", () => {
        const raw = Buffer.concat(chunks).toString("utf8");
        const id = `${Date.now()}-${process.pid}-${seq++}`;
        const mail: CapturedMail = {
          id,
          receivedAt: new Date().toISOString(),
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : "",
          to: session.envelope.rcptTo.map((r) => r.address),
          subject: header(raw, "Subject"),
          raw,
        };
        writeFileSync(path.join(opts.dir, `${id}.json`), JSON.stringify(mail));
        callback();
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(opts.port, "127.0.0.1", () => resolve());
  });
  const address = server.server.address();
  const port = typeof address === "object" && address ? address.port : opts.port;
  return { port, close: () => new Promise<void>((resolve) => server.close(() => resolve())) };
}

/**
 * Reads the messages captured in `dir`, newest first.
 * @example readCapturedMail(".data/mail").filter((m) => m.to.includes("sam.super@example.test"))
 */
export function readCapturedMail(dir: string): CapturedMail[] {
  let files: string[];
  try {
    files = readdirSync(dir).filter((f) => f.endsWith(".json"));
  } catch {
    return [];
  }
  return files
    .map((f) => JSON.parse(readFileSync(path.join(dir, f), "utf8")) as CapturedMail)
    .sort((a, b) => b.receivedAt.localeCompare(a.receivedAt));
}
