import { versionedRepo } from "../repo";

/** Data access for device profiles and their versions. */
export const devicesRepo = versionedRepo("device_profiles", "device_profile_versions");
