import { sql, type Kysely } from 'kysely';

// The record-keeping model: fleet → users, units → inspections → steps → defects → repairs,
// the next driver's acknowledgement, attachments, vocabulary versions, mail outbox, audit log.
// Inspection reports and their repair certifications are kept at least 3 months (49 CFR 396.11),
// so nothing here is deleted by the app: rows are retired, locked or superseded instead.

const timestamps = (t: string) => sql.raw(`
  CREATE TRIGGER ${t}_touch BEFORE UPDATE ON ${t}
  FOR EACH ROW EXECUTE FUNCTION touch_updated_at();`);

export async function up(db: Kysely<any>): Promise<void> {
  await sql`CREATE EXTENSION IF NOT EXISTS pgcrypto`.execute(db);
  await sql`
    CREATE FUNCTION touch_updated_at() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN NEW.updated_at := now(); RETURN NEW; END $$;
  `.execute(db);

  await db.schema
    .createTable('fleet')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('slug', 'text', (c) => c.notNull().unique())
    .addColumn('timezone', 'text', (c) => c.notNull().defaultTo('America/Chicago'))
    .addColumn('rule_profile', 'text', (c) => c.notNull().defaultTo('us-federal'))
    .addColumn('min_pretrip_minutes', 'integer', (c) => c.notNull().defaultTo(15).check(sql`min_pretrip_minutes BETWEEN 0 AND 240`))
    .addColumn('min_posttrip_minutes', 'integer', (c) => c.notNull().defaultTo(5).check(sql`min_posttrip_minutes BETWEEN 0 AND 240`))
    .addColumn('tire_pressure_targets', 'jsonb', (c) => c.notNull().defaultTo(sql`'{"steer": 110, "drive": 100, "trailer": 100}'::jsonb`))
    .addColumn('maintenance_email', 'text')
    .addColumn('supervisor_email', 'text')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('fleet_rule_profile_known', sql`rule_profile IN ('us-federal', 'ca-nsc13')`)
    .execute();
  await timestamps('fleet').execute(db);

  await db.schema
    .createTable('app_user')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('fleet_id', 'uuid', (c) => c.notNull().references('fleet.id'))
    .addColumn('email', 'text', (c) => c.notNull())
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('password_hash', 'text', (c) => c.notNull())
    .addColumn('roles', sql`text[]`, (c) => c.notNull().defaultTo(sql`'{}'::text[]`))
    .addColumn('active', 'boolean', (c) => c.notNull().defaultTo(true))
    .addColumn('must_change_password', 'boolean', (c) => c.notNull().defaultTo(false))
    .addColumn('last_sign_in_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('app_user_roles_known', sql`roles <@ ARRAY['driver','mechanic','supervisor','trainer','admin']::text[]`)
    .addCheckConstraint('app_user_email_lower', sql`email = lower(email)`)
    .execute();
  await db.schema.createIndex('app_user_email_key').on('app_user').column('email').unique().execute();
  await db.schema.createIndex('app_user_fleet_idx').on('app_user').columns(['fleet_id', 'name']).execute();
  await timestamps('app_user').execute(db);

  await db.schema
    .createTable('unit')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('fleet_id', 'uuid', (c) => c.notNull().references('fleet.id'))
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind IN ('tractor', 'trailer')`))
    .addColumn('unit_number', 'text', (c) => c.notNull())
    .addColumn('plate', 'text')
    .addColumn('plate_jurisdiction', 'text')
    .addColumn('vin', 'text')
    .addColumn('make', 'text')
    .addColumn('model', 'text')
    .addColumn('year', 'integer', (c) => c.check(sql`year BETWEEN 1950 AND 2100`))
    // [{ "position": "steer" | "drive" | "trailer", "tires": ["LO","RO"...], "coldPsi": 110, "chamber": "30L" }]
    .addColumn('axles', 'jsonb', (c) => c.notNull().defaultTo(sql`'[]'::jsonb`))
    .addColumn('status', 'text', (c) => c.notNull().defaultTo('in_service').check(sql`status IN ('in_service', 'out_of_service')`))
    .addColumn('status_changed_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('retired_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('unit_fleet_number_key').on('unit').columns(['fleet_id', 'unit_number']).unique().execute();
  await db.schema.createIndex('unit_fleet_status_idx').on('unit').columns(['fleet_id', 'status']).execute();
  await timestamps('unit').execute(db);

  await db.schema
    .createTable('vocabulary_version')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('fleet_id', 'uuid', (c) => c.notNull().references('fleet.id'))
    .addColumn('label', 'text', (c) => c.notNull())
    .addColumn('status', 'text', (c) => c.notNull().defaultTo('draft').check(sql`status IN ('draft', 'published')`))
    .addColumn('based_on_id', 'uuid', (c) => c.references('vocabulary_version.id'))
    // The whole grammar as one document (grammars/*.json shape): what the matcher loads.
    .addColumn('grammar', 'jsonb', (c) => c.notNull())
    .addColumn('published_at', 'timestamptz')
    .addColumn('published_by', 'uuid', (c) => c.references('app_user.id'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('vocabulary_version_fleet_label_key').on('vocabulary_version').columns(['fleet_id', 'label']).unique().execute();
  await timestamps('vocabulary_version').execute(db);
  // A published version is immutable.
  await sql`
    CREATE FUNCTION vocabulary_version_frozen() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF OLD.status = 'published' THEN
        RAISE EXCEPTION 'vocabulary version % is published and cannot change', OLD.label USING ERRCODE = 'check_violation';
      END IF;
      RETURN COALESCE(NEW, OLD);
    END $$;
    CREATE TRIGGER vocabulary_version_frozen BEFORE UPDATE OR DELETE ON vocabulary_version
    FOR EACH ROW EXECUTE FUNCTION vocabulary_version_frozen();
  `.execute(db);

  await db.schema
    .createTable('vocabulary_term')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('fleet_id', 'uuid', (c) => c.notNull().references('fleet.id'))
    .addColumn('version_id', 'uuid', (c) => c.notNull().references('vocabulary_version.id'))
    .addColumn('term_key', 'text', (c) => c.notNull())
    .addColumn('system_id', 'text', (c) => c.notNull())
    .addColumn('component', 'text', (c) => c.notNull())
    .addColumn('condition', 'text', (c) => c.notNull())
    .addColumn('severity_us', 'text', (c) => c.check(sql`severity_us IN ('minor', 'major')`))
    .addColumn('severity_ca', 'text', (c) => c.check(sql`severity_ca IN ('minor', 'major')`))
    .addColumn('source', 'text')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('vocabulary_term_version_key').on('vocabulary_term').columns(['version_id', 'term_key']).unique().execute();
  await timestamps('vocabulary_term').execute(db);

  await db.schema
    .createTable('vocabulary_phrase')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('fleet_id', 'uuid', (c) => c.notNull().references('fleet.id'))
    .addColumn('version_id', 'uuid', (c) => c.notNull().references('vocabulary_version.id'))
    .addColumn('term_id', 'uuid', (c) => c.notNull().references('vocabulary_term.id'))
    .addColumn('phrase', 'text', (c) => c.notNull())
    .addColumn('origin', 'text', (c) => c.notNull().defaultTo('default').check(sql`origin IN ('default', 'trainer', 'field')`))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('vocabulary_phrase_term_key').on('vocabulary_phrase').columns(['term_id', 'phrase']).unique().execute();

  await db.schema
    .createTable('inspection')
    .addColumn('id', 'uuid', (c) => c.primaryKey()) // generated on the device
    .addColumn('fleet_id', 'uuid', (c) => c.notNull().references('fleet.id'))
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind IN ('pre_trip', 'post_trip')`))
    .addColumn('driver_id', 'uuid', (c) => c.notNull().references('app_user.id'))
    .addColumn('tractor_id', 'uuid', (c) => c.notNull().references('unit.id'))
    .addColumn('trailer_id', 'uuid', (c) => c.references('unit.id'))
    .addColumn('odometer', 'integer', (c) => c.check(sql`odometer >= 0`))
    .addColumn('location', 'text')
    .addColumn('bill_of_lading', 'text')
    .addColumn('seal_number', 'text')
    .addColumn('rule_profile', 'text', (c) => c.notNull().defaultTo('us-federal'))
    .addColumn('vocabulary_version_id', 'uuid', (c) => c.references('vocabulary_version.id'))
    .addColumn('status', 'text', (c) => c.notNull().defaultTo('draft').check(sql`status IN ('draft', 'submitted')`))
    .addColumn('started_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('finished_at', 'timestamptz')
    .addColumn('duration_s', 'integer', (c) => c.check(sql`duration_s >= 0`))
    .addColumn('certification_text', 'text')
    .addColumn('signature_name', 'text')
    .addColumn('signature_key', 'text') // object key of a drawn signature, if any
    .addColumn('signed_at', 'timestamptz')
    .addColumn('content_hash', 'text') // sha-256 of the locked report's canonical JSON
    .addColumn('reviewed_at', 'timestamptz')
    .addColumn('reviewed_by', 'uuid', (c) => c.references('app_user.id'))
    .addColumn('review_note', 'text')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('inspection_submitted_is_signed', sql`status <> 'submitted' OR (finished_at IS NOT NULL AND signed_at IS NOT NULL AND content_hash IS NOT NULL)`)
    .execute();
  await db.schema.createIndex('inspection_fleet_started_idx').on('inspection').columns(['fleet_id', 'started_at desc']).execute();
  await db.schema.createIndex('inspection_fleet_driver_idx').on('inspection').columns(['fleet_id', 'driver_id', 'started_at desc']).execute();
  await db.schema.createIndex('inspection_tractor_idx').on('inspection').columns(['tractor_id', 'started_at desc']).execute();
  await db.schema.createIndex('inspection_trailer_idx').on('inspection').columns(['trailer_id', 'started_at desc']).execute();
  await timestamps('inspection').execute(db);

  await db.schema
    .createTable('inspection_step')
    .addColumn('id', 'uuid', (c) => c.primaryKey()) // generated on the device: a replay records once
    .addColumn('fleet_id', 'uuid', (c) => c.notNull().references('fleet.id'))
    .addColumn('inspection_id', 'uuid', (c) => c.notNull().references('inspection.id'))
    .addColumn('seq', 'integer', (c) => c.notNull())
    .addColumn('zone', 'text', (c) => c.notNull())
    .addColumn('item', 'text')
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind IN ('ok', 'defect', 'measurement', 'zone_ok', 'visit', 'undo', 'note', 'photo')`))
    .addColumn('heard', 'text') // what the recogniser returned (or what was typed)
    .addColumn('alternatives', 'jsonb', (c) => c.notNull().defaultTo(sql`'[]'::jsonb`))
    .addColumn('input_mode', 'text', (c) => c.notNull().defaultTo('tap').check(sql`input_mode IN ('voice', 'tap', 'typed')`))
    .addColumn('term_key', 'text')
    .addColumn('component', 'text')
    .addColumn('condition', 'text')
    .addColumn('position', 'text')
    .addColumn('score', 'real', (c) => c.check(sql`score BETWEEN 0 AND 1`))
    .addColumn('resolution', 'text', (c) => c.check(sql`resolution IN ('auto', 'confirmed', 'corrected')`))
    .addColumn('undoes_step_id', 'uuid', (c) => c.references('inspection_step.id'))
    .addColumn('measurement_kind', 'text')
    .addColumn('value', 'numeric')
    .addColumn('unit', 'text')
    .addColumn('verdict', 'text', (c) => c.check(sql`verdict IN ('pass', 'fail')`))
    .addColumn('severity', 'text', (c) => c.check(sql`severity IN ('minor', 'major')`))
    .addColumn('limit_text', 'text')
    .addColumn('source', 'text')
    .addColumn('device_at', 'timestamptz', (c) => c.notNull())
    .addColumn('server_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('inspection_step_inspection_seq_idx').on('inspection_step').columns(['inspection_id', 'seq']).execute();

  await db.schema
    .createTable('defect')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('fleet_id', 'uuid', (c) => c.notNull().references('fleet.id'))
    .addColumn('inspection_id', 'uuid', (c) => c.notNull().references('inspection.id'))
    .addColumn('step_id', 'uuid', (c) => c.notNull().unique().references('inspection_step.id'))
    .addColumn('unit_id', 'uuid', (c) => c.notNull().references('unit.id'))
    .addColumn('zone', 'text', (c) => c.notNull())
    .addColumn('component', 'text', (c) => c.notNull())
    .addColumn('condition', 'text', (c) => c.notNull())
    .addColumn('position', 'text')
    .addColumn('severity', 'text', (c) => c.notNull().check(sql`severity IN ('minor', 'major')`))
    .addColumn('description', 'text', (c) => c.notNull())
    .addColumn('status', 'text', (c) => c.notNull().defaultTo('open').check(sql`status IN ('open', 'repaired', 'no_repair_needed')`))
    .addColumn('repair_work', 'text')
    .addColumn('repair_parts', 'text')
    .addColumn('repair_notes', 'text')
    .addColumn('certified_by', 'uuid', (c) => c.references('app_user.id'))
    .addColumn('certified_name', 'text')
    .addColumn('certification_text', 'text')
    .addColumn('certified_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('defect_closed_is_certified', sql`status = 'open' OR (certified_by IS NOT NULL AND certified_at IS NOT NULL AND certified_name IS NOT NULL)`)
    .execute();
  await db.schema.createIndex('defect_fleet_status_idx').on('defect').columns(['fleet_id', 'status', 'severity']).execute();
  await db.schema.createIndex('defect_unit_status_idx').on('defect').columns(['unit_id', 'status']).execute();
  await db.schema.createIndex('defect_inspection_idx').on('defect').column('inspection_id').execute();
  await timestamps('defect').execute(db);

  await db.schema
    .createTable('acknowledgement')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('fleet_id', 'uuid', (c) => c.notNull().references('fleet.id'))
    .addColumn('unit_id', 'uuid', (c) => c.notNull().references('unit.id'))
    .addColumn('reviewed_inspection_id', 'uuid', (c) => c.notNull().references('inspection.id'))
    .addColumn('inspection_id', 'uuid', (c) => c.references('inspection.id')) // the new walk it opened, if any
    .addColumn('driver_id', 'uuid', (c) => c.notNull().references('app_user.id'))
    .addColumn('signature_name', 'text', (c) => c.notNull())
    .addColumn('statement', 'text', (c) => c.notNull())
    .addColumn('acknowledged_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('acknowledgement_unit_idx').on('acknowledgement').columns(['unit_id', 'acknowledged_at desc']).execute();
  await db.schema.createIndex('acknowledgement_reviewed_idx').on('acknowledgement').column('reviewed_inspection_id').execute();

  await db.schema
    .createTable('attachment')
    .addColumn('id', 'uuid', (c) => c.primaryKey()) // generated on the device
    .addColumn('fleet_id', 'uuid', (c) => c.notNull().references('fleet.id'))
    .addColumn('inspection_id', 'uuid', (c) => c.references('inspection.id'))
    .addColumn('step_id', 'uuid', (c) => c.references('inspection_step.id'))
    .addColumn('defect_id', 'uuid', (c) => c.references('defect.id'))
    .addColumn('object_key', 'text', (c) => c.notNull().unique())
    .addColumn('content_type', 'text', (c) => c.notNull())
    .addColumn('size_bytes', 'integer', (c) => c.notNull().check(sql`size_bytes >= 0`))
    .addColumn('sha256', 'text', (c) => c.notNull())
    .addColumn('uploaded_by', 'uuid', (c) => c.notNull().references('app_user.id'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('attachment_inspection_idx').on('attachment').column('inspection_id').execute();
  await db.schema.createIndex('attachment_defect_idx').on('attachment').column('defect_id').execute();

  await db.schema
    .createTable('field_utterance')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('fleet_id', 'uuid', (c) => c.notNull().references('fleet.id'))
    .addColumn('step_id', 'uuid', (c) => c.references('inspection_step.id'))
    .addColumn('zone', 'text')
    .addColumn('text', 'text', (c) => c.notNull())
    .addColumn('normalized', 'text', (c) => c.notNull())
    .addColumn('outcome', 'text', (c) => c.notNull().check(sql`outcome IN ('unmatched', 'low_score', 'corrected')`))
    .addColumn('term_key', 'text')
    .addColumn('score', 'real')
    .addColumn('resolved_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('field_utterance_fleet_idx').on('field_utterance').columns(['fleet_id', 'normalized']).execute();

  await db.schema
    .createTable('mail_outbox')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('fleet_id', 'uuid', (c) => c.references('fleet.id'))
    .addColumn('kind', 'text', (c) => c.notNull())
    .addColumn('to_addresses', sql`text[]`, (c) => c.notNull())
    .addColumn('subject', 'text', (c) => c.notNull())
    .addColumn('text_body', 'text', (c) => c.notNull())
    .addColumn('html_body', 'text')
    .addColumn('status', 'text', (c) => c.notNull().defaultTo('pending').check(sql`status IN ('pending', 'sent', 'failed')`))
    .addColumn('attempts', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('last_error', 'text')
    .addColumn('sent_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('mail_outbox_status_idx').on('mail_outbox').columns(['status', 'created_at']).execute();
  await timestamps('mail_outbox').execute(db);

  await db.schema
    .createTable('audit_log')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('fleet_id', 'uuid', (c) => c.references('fleet.id'))
    .addColumn('actor_id', 'uuid', (c) => c.references('app_user.id'))
    .addColumn('action', 'text', (c) => c.notNull())
    .addColumn('entity', 'text', (c) => c.notNull())
    .addColumn('entity_id', 'text')
    .addColumn('detail', 'jsonb', (c) => c.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('audit_log_fleet_idx').on('audit_log').columns(['fleet_id', 'created_at desc']).execute();
  await sql`
    CREATE FUNCTION audit_log_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN RAISE EXCEPTION 'audit_log is append-only' USING ERRCODE = 'insufficient_privilege'; END $$;
    CREATE TRIGGER audit_log_append_only BEFORE UPDATE OR DELETE ON audit_log
    FOR EACH ROW EXECUTE FUNCTION audit_log_append_only();
  `.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const t of ['audit_log', 'mail_outbox', 'field_utterance', 'attachment', 'acknowledgement', 'defect', 'inspection_step', 'inspection', 'vocabulary_phrase', 'vocabulary_term', 'vocabulary_version', 'unit', 'app_user', 'fleet']) {
    await db.schema.dropTable(t).ifExists().cascade().execute();
  }
  await sql`DROP FUNCTION IF EXISTS audit_log_append_only, vocabulary_version_frozen, touch_updated_at`.execute(db);
}
