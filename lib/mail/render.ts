import { readFileSync } from "node:fs";
import path from "node:path";

/** A rendered message body in both forms. */
export interface RenderedMail {
  subject: string;
  text: string;
  html: string;
}

const cache = new Map<string, string>();

function load(file: string): string {
  const full = path.join(process.cwd(), "templates", "mail", file);
  if (!cache.has(full) || process.env.NODE_ENV !== "production") cache.set(full, readFileSync(full, "utf8"));
  return cache.get(full)!;
}

function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);
}

function fill(template: string, vars: Record<string, string>, escape: boolean): string {
  return template.replace(/\{\{\s*(\w+)\s*\}\}/g, (_, key: string) => {
    if (!(key in vars)) throw new Error(`Mail template variable {{${key}}} has no value`);
    return escape ? escapeHtml(vars[key]) : vars[key];
  });
}

/**
 * Renders templates/mail/<name>.txt and .html (first line of the .txt is "Subject: …").
 * Values are HTML-escaped in the HTML body.
 * @example renderMail("signed-off", { code: "LFQ-001", version: "2", link: "http://…" })
 */
export function renderMail(name: string, vars: Record<string, string>): RenderedMail {
  const text = fill(load(`${name}.txt`), vars, false);
  const [first, ...rest] = text.split("\n");
  if (!first.startsWith("Subject: ")) throw new Error(`templates/mail/${name}.txt must start with "Subject: "`);
  const body = fill(load(`${name}.html`), vars, true);
  const html = fill(load("layout.html"), { body: "{{body}}" }, false).replace("{{body}}", body);
  return { subject: first.slice("Subject: ".length).trim(), text: rest.join("\n").trimStart(), html };
}
