/**
 * The plain-text part of a raw MIME message (as the local mail sink stores it), decoded from quoted-printable or
 * base64; the whole body when the message has a single part.
 * @example plainTextOf(raw).startsWith("Quinn Abara signed off") // for a sign-off message
 */
export function plainTextOf(raw: string): string {
  const lines = raw.replace(/\r\n/g, "\n");
  const match = /Content-Type:\s*text\/plain[^\n]*(?:\n[ \t][^\n]*)*\n((?:[A-Za-z-]+:[^\n]*\n)*)\n([\s\S]*?)(?=\n--[^\n]+|$)/i.exec(lines);
  const [headers, body] = match ? [match[1], match[2]] : [lines.split("\n\n")[0] ?? "", lines.split("\n\n").slice(1).join("\n\n")];
  const encoding = /Content-Transfer-Encoding:\s*([\w-]+)/i.exec(headers)?.[1]?.toLowerCase();
  if (encoding === "base64") return Buffer.from(body.replace(/\s+/g, ""), "base64").toString("utf8");
  if (encoding === "quoted-printable") {
    const bytes = body.replace(/=\n/g, "").replace(/=([0-9A-F]{2})/gi, (_, h: string) => String.fromCharCode(parseInt(h, 16)));
    return Buffer.from(bytes, "latin1").toString("utf8");
  }
  return body;
}

/**
 * The Subject header of a raw message, unfolded and decoded (RFC 2047: whitespace between two adjacent encoded
 * words is dropped, so a long subject split across words reads as it was written).
 * @example subjectOf("Subject: =?UTF-8?Q?Signed_off:_A?=\r\n =?UTF-8?Q?BC_=E2=80=94_x?=\r\n\r\nbody") // "Signed off: ABC — x"
 */
export function subjectOf(raw: string): string {
  const head = raw.split(/\r?\n\r?\n/)[0] ?? "";
  const unfolded = head.replace(/\r?\n[ \t]+/g, " ");
  const value = /^Subject:[ \t]*(.*)$/im.exec(unfolded)?.[1] ?? "";
  const word = /=\?([^?]+)\?([bqBQ])\?([^?]*)\?=/g;
  return value
    .replace(/(=\?[^?]+\?[bqBQ]\?[^?]*\?=)\s+(?==\?)/g, "$1")
    .replace(word, (_, _charset: string, enc: string, text: string) =>
      enc.toLowerCase() === "b"
        ? Buffer.from(text, "base64").toString("utf8")
        : Buffer.from(text.replace(/_/g, " ").replace(/=([0-9A-F]{2})/gi, (_m, h: string) => String.fromCharCode(parseInt(h, 16))), "latin1").toString("utf8"),
    )
    .trim();
}
