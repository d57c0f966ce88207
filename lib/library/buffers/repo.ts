import { versionedRepo } from "../repo";

/** Data access for buffers and their versions. */
export const buffersRepo = versionedRepo("buffers", "buffer_versions");
