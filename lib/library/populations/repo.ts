import { versionedRepo } from "../repo";

/** Data access for populations and their versions. */
export const populationsRepo = versionedRepo("populations", "population_versions");
