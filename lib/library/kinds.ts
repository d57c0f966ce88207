import type { z } from "zod";
import { buffersRepo } from "./buffers/repo";
import { bufferContentSchema, describeBuffer, type BufferContent } from "./buffers/content";
import { devicesRepo } from "./devices/repo";
import { deviceContentSchema, describeDevice, type DeviceContent } from "./devices/content";
import { describePopulation, populationContentSchema, type DisplayRow, type PopulationContent } from "./populations/content";
import { populationsRepo } from "./populations/repo";
import type { VersionedRepo } from "./repo";

/** The three libraries, as they appear in URLs and exports. */
export const LIBRARY_KINDS = ["populations", "buffers", "devices"] as const;
export type LibraryKind = (typeof LIBRARY_KINDS)[number];

/** Content type of each kind (SI). */
export interface ContentOf {
  populations: PopulationContent;
  buffers: BufferContent;
  devices: DeviceContent;
}

/** Everything the service needs to know about a kind. */
export interface KindInfo<K extends LibraryKind> {
  kind: K;
  label: string;
  singular: string;
  /** Audit entity type. */
  entityType: string;
  repo: VersionedRepo;
  schema: z.ZodType<ContentOf[K], unknown>;
  describe: (c: ContentOf[K]) => DisplayRow[];
  /** The list column "category": population kind, device geometry; none for buffers. */
  category: (c: ContentOf[K]) => string | null;
  /** Where protocol_versions.content_json keeps references to items of this kind. */
  refPaths: string[];
}

const INFO: { [K in LibraryKind]: KindInfo<K> } = {
  populations: {
    kind: "populations",
    label: "Populations",
    singular: "population",
    entityType: "population",
    repo: populationsRepo,
    schema: populationContentSchema as z.ZodType<PopulationContent, unknown>,
    describe: describePopulation,
    category: (c) => c.kind,
    refPaths: ["$.populations.target.libraryRef", "$.populations.other.libraryRef"],
  },
  buffers: {
    kind: "buffers",
    label: "Buffers",
    singular: "buffer",
    entityType: "buffer",
    repo: buffersRepo,
    schema: bufferContentSchema as z.ZodType<BufferContent, unknown>,
    describe: describeBuffer,
    category: () => null,
    refPaths: ["$.buffer.libraryRef"],
  },
  devices: {
    kind: "devices",
    label: "Devices",
    singular: "device profile",
    entityType: "device_profile",
    repo: devicesRepo,
    schema: deviceContentSchema as z.ZodType<DeviceContent, unknown>,
    describe: describeDevice,
    category: (c) => c.geometry.kind,
    refPaths: ["$.device.libraryRef"],
  },
};

/**
 * The description of a library kind.
 * @example kindInfo("buffers").repo.versionsTable // "buffer_versions"
 */
export function kindInfo<K extends LibraryKind>(kind: K): KindInfo<K> {
  return INFO[kind];
}

/** Type guard for a kind read from a URL. */
export function isLibraryKind(value: unknown): value is LibraryKind {
  return typeof value === "string" && (LIBRARY_KINDS as readonly string[]).includes(value);
}
