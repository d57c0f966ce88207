import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import nodemailer from "nodemailer";
import { afterAll, describe, expect, it } from "vitest";
import { readCapturedMail, startMailSink } from "@/lib/mail/sink";

describe("local SMTP sink", () => {
  const dir = mkdtempSync(path.join(tmpdir(), "sw-sink-"));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it("captures a message with its recipients and decodes a long, folded, non-ASCII subject exactly", async () => {
    const sink = await startMailSink({ port: 0, dir });
    const transport = nodemailer.createTransport({ host: "127.0.0.1", port: sink.port, secure: false, ignoreTLS: true });
    const subject = "Signed off: LFQ-0001 version 2 — viable vs heat-killed yeast, lot 17 96164335624, Å Ä Ö, a subject long enough to fold";
    await transport.sendMail({ from: "no-reply@sievewright.test", to: "sam.super@example.test", subject, text: "body" });
    transport.close();
    await sink.close();
    const [mail] = readCapturedMail(dir);
    expect(mail.to).toEqual(["sam.super@example.test"]);
    expect(mail.subject).toBe(subject);
  });
});
