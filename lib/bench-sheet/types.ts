import type { ProtocolContent } from "@/lib/protocols/content";
import type { VersionState } from "@/lib/protocols/states";
import type { PaperSize, SectionId } from "@/templates/bench-sheet/layout";

/** One electronic signature on the version, with the signer's name. */
export interface SheetSignature {
  signerName: string;
  signerRole: string;
  meaning: string;
  signedAt: Date;
  contentHash: string;
}

/** Everything the sheet is built from: the protocol, the version, its signatures and its frozen content. */
export interface BenchSheetSource {
  protocol: { id: number; code: string; title: string; purpose: string };
  version: { id: number; number: number; state: VersionState; contentHash: string; engineVersion: string };
  signatures: SheetSignature[];
  content: ProtocolContent;
  /** Problems found when the stored content was re-hashed on read (empty when content and signatures agree). */
  integrityProblems?: string[];
}

/** What the person printing chooses, and when it is printed. */
export interface BenchSheetOptions {
  volumeMl: number;
  paper: PaperSize;
  printedAt: Date;
  printedBy?: string;
  /** The stored copy of a signed version: `printedAt` is the approval time and no printer is named. */
  issued?: boolean;
}

/** A piece of a section, in reading order. */
export type SheetBlock =
  | { kind: "paragraph"; text: string; style?: "body" | "strong" | "note" | "formula" }
  | { kind: "fields"; rows: { label: string; value: string }[] }
  | { kind: "table"; columns: { title: string; width: number }[]; rows: string[][]; caption?: string }
  | { kind: "steps"; items: string[] }
  | { kind: "bullets"; items: string[] }
  | { kind: "record"; lines: { label: string; unit?: string; lines?: number }[] };

/** One numbered part of the sheet. */
export interface SheetSection {
  id: SectionId;
  title: string;
  blocks: SheetBlock[];
}

/** The whole sheet as data: the renderer draws exactly this. */
export interface BenchSheetLayout {
  paper: PaperSize;
  header: { code: string; title: string; purpose: string; versionLabel: string; stateLabel: string; runningHeader: string; meta: string };
  /** The diagonal mark's text on every page, or null for an approved, correctly signed version. */
  mark: string | null;
  sections: SheetSection[];
  footer: { signatureLines: string[]; hashLine: string };
}
