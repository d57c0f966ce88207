/**
 * File and body sizes for people, in binary multiples (IEC 80000-13: 1 KiB = 1024 bytes, 1 MiB = 1024² bytes), as
 * upload limits are set. Pure.
 */
import { sig } from "./number";

/**
 * A size in bytes as bytes, KiB or MiB (3 significant figures); with `exact` the byte count beside it.
 * @example formatFileSize(1536) // "1.5 KiB"
 * @example formatFileSize(5 * 1024 * 1024, { exact: true }) // "5 MiB (5242880 bytes)"
 * @example formatFileSize(12) // "12 bytes"
 */
export function formatFileSize(bytes: number, options: { exact?: boolean } = {}): string {
  const n = Math.max(0, Math.round(bytes));
  let text: string;
  if (n >= 1024 * 1024) text = `${sig(n / 1024 / 1024)} MiB`;
  else if (n >= 1024) text = `${sig(n / 1024)} KiB`;
  else return `${n} ${n === 1 ? "byte" : "bytes"}`;
  return options.exact ? `${text} (${n} bytes)` : text;
}
