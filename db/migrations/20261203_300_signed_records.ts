import type { Knex } from "knex";

/**
 * Signatures and the signed content of protocol versions cannot be changed in the database, whoever asks: triggers
 * that refuse (SIGNAL 45000) any UPDATE or DELETE of a signature, and any UPDATE of a signed version's content columns
 * (content, content hash, engine version, protocol, number, author) or DELETE of a signed version. A version counts as
 * signed once it has a signature or has been approved (approved, superseded, retired). Workflow columns (state,
 * timestamps, lock_version) still change. The app account additionally has no UPDATE/DELETE grant on signatures.
 */
export async function up(knex: Knex): Promise<void> {
  await knex.raw(`CREATE TRIGGER signatures_no_update BEFORE UPDATE ON signatures FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'signatures cannot be changed: an electronic signature is permanent'`);
  await knex.raw(`CREATE TRIGGER signatures_no_delete BEFORE DELETE ON signatures FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'signatures cannot be deleted: an electronic signature is permanent'`);
  await knex.raw(`CREATE TRIGGER protocol_versions_signed_content BEFORE UPDATE ON protocol_versions FOR EACH ROW
    BEGIN
      IF (OLD.state IN ('approved', 'superseded', 'retired') OR EXISTS (SELECT 1 FROM signatures s WHERE s.version_id = OLD.id))
        AND (NOT (NEW.content_json <=> OLD.content_json) OR NOT (NEW.content_hash <=> OLD.content_hash)
          OR NOT (NEW.engine_version <=> OLD.engine_version) OR NOT (NEW.protocol_id <=> OLD.protocol_id)
          OR NOT (NEW.number <=> OLD.number) OR NOT (NEW.author_id <=> OLD.author_id)) THEN
        SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'protocol_versions: the signed content of a version cannot be changed';
      END IF;
    END`);
  await knex.raw(`CREATE TRIGGER protocol_versions_signed_no_delete BEFORE DELETE ON protocol_versions FOR EACH ROW
    BEGIN
      IF OLD.state IN ('approved', 'superseded', 'retired') OR EXISTS (SELECT 1 FROM signatures s WHERE s.version_id = OLD.id) THEN
        SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'protocol_versions: a signed version cannot be deleted';
      END IF;
    END`);
}

export async function down(knex: Knex): Promise<void> {
  for (const t of ["protocol_versions_signed_no_delete", "protocol_versions_signed_content", "signatures_no_delete", "signatures_no_update"]) {
    await knex.raw(`DROP TRIGGER IF EXISTS ${t}`);
  }
}
