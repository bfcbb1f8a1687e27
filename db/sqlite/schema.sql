CREATE TABLE IF NOT EXISTS "__EFMigrationsHistory" (
    "MigrationId" TEXT NOT NULL CONSTRAINT "PK___EFMigrationsHistory" PRIMARY KEY,
    "ProductVersion" TEXT NOT NULL
);

BEGIN TRANSACTION;
CREATE TABLE "ingest_batches" (
    "id" INTEGER NOT NULL CONSTRAINT "PK_ingest_batches" PRIMARY KEY AUTOINCREMENT,
    "source" TEXT NOT NULL,
    "label" TEXT NULL,
    "received_at_ms" INTEGER NOT NULL,
    "completed_at_ms" INTEGER NOT NULL,
    "row_count" INTEGER NOT NULL,
    "inserted" INTEGER NOT NULL,
    "already_present" INTEGER NOT NULL
);

CREATE TABLE "lot_chambers" (
    "lot_id" TEXT NOT NULL,
    "step" TEXT NOT NULL,
    "chamber" TEXT NOT NULL,
    CONSTRAINT "PK_lot_chambers" PRIMARY KEY ("lot_id", "step", "chamber")
);

CREATE TABLE "products" (
    "id" INTEGER NOT NULL CONSTRAINT "PK_products" PRIMARY KEY AUTOINCREMENT,
    "code" TEXT NOT NULL,
    "name" TEXT NOT NULL,
    "description" TEXT NOT NULL,
    "gate_faces" TEXT NOT NULL,
    "nominal_top_width_nm" REAL NOT NULL,
    "nominal_bottom_width_nm" REAL NOT NULL,
    "nominal_fin_height_nm" REAL NOT NULL,
    "nominal_corner_radius_nm" REAL NOT NULL,
    "nominal_liner_thickness_nm" REAL NOT NULL,
    "created_at_ms" INTEGER NOT NULL,
    "updated_at_ms" INTEGER NOT NULL
);

CREATE TABLE "lot_steps" (
    "lot_id" TEXT NOT NULL,
    "step" TEXT NOT NULL,
    "product_id" INTEGER NOT NULL,
    "first_measured_at_ms" INTEGER NOT NULL,
    "last_measured_at_ms" INTEGER NOT NULL,
    "wafer_count" INTEGER NOT NULL,
    "site_count" INTEGER NOT NULL,
    CONSTRAINT "PK_lot_steps" PRIMARY KEY ("lot_id", "step"),
    CONSTRAINT "FK_lot_steps_products_product_id" FOREIGN KEY ("product_id") REFERENCES "products" ("id") ON DELETE RESTRICT
);

CREATE TABLE "measurements" (
    "id" INTEGER NOT NULL CONSTRAINT "PK_measurements" PRIMARY KEY AUTOINCREMENT,
    "batch_id" INTEGER NOT NULL,
    "lot_id" TEXT NOT NULL,
    "wafer_slot" INTEGER NOT NULL,
    "site_id" TEXT NOT NULL,
    "site_x_mm" REAL NOT NULL,
    "site_y_mm" REAL NOT NULL,
    "product_id" INTEGER NOT NULL,
    "step" TEXT NOT NULL,
    "etch_tool" TEXT NULL,
    "etch_chamber" TEXT NULL,
    "liner_tool" TEXT NULL,
    "liner_chamber" TEXT NULL,
    "metrology_tool" TEXT NULL,
    "operator" TEXT NULL,
    "measured_at_ms" INTEGER NOT NULL,
    "top_width_nm" REAL NULL,
    "bottom_width_nm" REAL NULL,
    "fin_height_nm" REAL NULL,
    "corner_radius_nm" REAL NULL,
    "liner_thickness_nm" REAL NULL,
    "taper_deg" REAL NULL,
    "mid_width_nm" REAL NULL,
    "area_nm2" REAL NULL,
    "gated_perimeter_nm" REAL NULL,
    "max_corner_radius_nm" REAL NULL,
    "flags" INTEGER NOT NULL,
    CONSTRAINT "FK_measurements_ingest_batches_batch_id" FOREIGN KEY ("batch_id") REFERENCES "ingest_batches" ("id") ON DELETE RESTRICT,
    CONSTRAINT "FK_measurements_products_product_id" FOREIGN KEY ("product_id") REFERENCES "products" ("id") ON DELETE RESTRICT
);

CREATE TABLE "spec_limits" (
    "id" INTEGER NOT NULL CONSTRAINT "PK_spec_limits" PRIMARY KEY AUTOINCREMENT,
    "product_id" INTEGER NOT NULL,
    "parameter" TEXT NOT NULL,
    "lower" REAL NULL,
    "target" REAL NULL,
    "upper" REAL NULL,
    CONSTRAINT "FK_spec_limits_products_product_id" FOREIGN KEY ("product_id") REFERENCES "products" ("id") ON DELETE CASCADE
);

CREATE INDEX "IX_lot_chambers_chamber" ON "lot_chambers" ("chamber");

CREATE INDEX "IX_lot_steps_last_measured_at_ms" ON "lot_steps" ("last_measured_at_ms");

CREATE INDEX "IX_lot_steps_product_id" ON "lot_steps" ("product_id");

CREATE INDEX "IX_measurements_batch_id" ON "measurements" ("batch_id");

CREATE UNIQUE INDEX "IX_measurements_lot_id_wafer_slot_site_id_step_measured_at_ms" ON "measurements" ("lot_id", "wafer_slot", "site_id", "step", "measured_at_ms");

CREATE INDEX "IX_measurements_product_id_step_measured_at_ms" ON "measurements" ("product_id", "step", "measured_at_ms");

CREATE UNIQUE INDEX "IX_products_code" ON "products" ("code");

CREATE UNIQUE INDEX "IX_spec_limits_product_id_parameter" ON "spec_limits" ("product_id", "parameter");

INSERT INTO "__EFMigrationsHistory" ("MigrationId", "ProductVersion")
VALUES ('20261202033223_Initial', '10.0.15');

COMMIT;

BEGIN TRANSACTION;
ALTER TABLE "products" ADD "model_channel_doping_cm3" REAL NOT NULL DEFAULT 1E+17;

ALTER TABLE "products" ADD "model_eot_nm" REAL NOT NULL DEFAULT 0.90000000000000002;

ALTER TABLE "products" ADD "model_gate_length_nm" REAL NOT NULL DEFAULT 20.0;

ALTER TABLE "products" ADD "model_sidewall_orientation" TEXT NOT NULL DEFAULT '110';

INSERT INTO "__EFMigrationsHistory" ("MigrationId", "ProductVersion")
VALUES ('20261202051633_ProductModelInputs', '10.0.15');

COMMIT;

BEGIN TRANSACTION;
ALTER TABLE "measurements" ADD "delta_dibl_mv_per_v" REAL NULL;

ALTER TABLE "measurements" ADD "delta_swing_lin_mv_per_dec" REAL NULL;

ALTER TABLE "measurements" ADD "delta_vt_lin_mv" REAL NULL;

ALTER TABLE "measurements" ADD "delta_vt_sat_mv" REAL NULL;

ALTER TABLE "measurements" ADD "model_stamp_id" INTEGER NULL;

CREATE TABLE "model_stamps" (
    "id" INTEGER NOT NULL CONSTRAINT "PK_model_stamps" PRIMARY KEY AUTOINCREMENT,
    "product_id" INTEGER NOT NULL,
    "parameter_set" TEXT NOT NULL,
    "parameter_set_version" TEXT NOT NULL,
    "code_version" TEXT NOT NULL,
    CONSTRAINT "FK_model_stamps_products_product_id" FOREIGN KEY ("product_id") REFERENCES "products" ("id") ON DELETE RESTRICT
);

CREATE UNIQUE INDEX "IX_model_stamps_product_id_parameter_set_parameter_set_version_code_version" ON "model_stamps" ("product_id", "parameter_set", "parameter_set_version", "code_version");

INSERT INTO "__EFMigrationsHistory" ("MigrationId", "ProductVersion")
VALUES ('20261202053214_PredictedShifts', '10.0.15');

COMMIT;

BEGIN TRANSACTION;
CREATE TABLE "model_parameter_sets" (
    "id" INTEGER NOT NULL CONSTRAINT "PK_model_parameter_sets" PRIMARY KEY AUTOINCREMENT,
    "product_id" INTEGER NOT NULL,
    "version" INTEGER NOT NULL,
    "gate_length_nm" REAL NOT NULL,
    "gate_length_sd_nm" REAL NOT NULL,
    "barrier_height_v" REAL NOT NULL,
    "barrier_height_sd_v" REAL NOT NULL,
    "threshold_offset_v" REAL NOT NULL,
    "threshold_offset_sd_v" REAL NOT NULL,
    "rms_residual_before_mv" REAL NOT NULL,
    "rms_residual_after_mv" REAL NOT NULL,
    "measurement_sd_mv" REAL NOT NULL,
    "observations" INTEGER NOT NULL,
    "iterations" INTEGER NOT NULL,
    "code_version" TEXT NOT NULL,
    "created_at_ms" INTEGER NOT NULL,
    "created_by" TEXT NOT NULL,
    "reason" TEXT NOT NULL,
    "source_name" TEXT NULL,
    CONSTRAINT "FK_model_parameter_sets_products_product_id" FOREIGN KEY ("product_id") REFERENCES "products" ("id") ON DELETE RESTRICT
);

CREATE TABLE "electrical_tests" (
    "id" INTEGER NOT NULL CONSTRAINT "PK_electrical_tests" PRIMARY KEY AUTOINCREMENT,
    "parameter_set_id" INTEGER NOT NULL,
    "product_id" INTEGER NOT NULL,
    "lot_id" TEXT NOT NULL,
    "wafer_slot" INTEGER NOT NULL,
    "vt_lin_v" REAL NOT NULL,
    "vt_sat_v" REAL NOT NULL,
    "tested_at_ms" INTEGER NOT NULL,
    "mean_top_width_nm" REAL NOT NULL,
    "mean_bottom_width_nm" REAL NOT NULL,
    "mean_fin_height_nm" REAL NOT NULL,
    "mean_corner_radius_nm" REAL NOT NULL,
    "sites" INTEGER NOT NULL,
    "residual_lin_mv" REAL NOT NULL,
    "residual_sat_mv" REAL NOT NULL,
    CONSTRAINT "FK_electrical_tests_model_parameter_sets_parameter_set_id" FOREIGN KEY ("parameter_set_id") REFERENCES "model_parameter_sets" ("id") ON DELETE RESTRICT,
    CONSTRAINT "FK_electrical_tests_products_product_id" FOREIGN KEY ("product_id") REFERENCES "products" ("id") ON DELETE RESTRICT
);

CREATE INDEX "IX_electrical_tests_lot_id_wafer_slot" ON "electrical_tests" ("lot_id", "wafer_slot");

CREATE INDEX "IX_electrical_tests_parameter_set_id" ON "electrical_tests" ("parameter_set_id");

CREATE INDEX "IX_electrical_tests_product_id" ON "electrical_tests" ("product_id");

CREATE UNIQUE INDEX "IX_model_parameter_sets_product_id_version" ON "model_parameter_sets" ("product_id", "version");

INSERT INTO "__EFMigrationsHistory" ("MigrationId", "ProductVersion")
VALUES ('20261202100505_Calibrations', '10.0.15');

COMMIT;

BEGIN TRANSACTION;
CREATE TABLE "chart_contexts" (
    "id" INTEGER NOT NULL CONSTRAINT "PK_chart_contexts" PRIMARY KEY AUTOINCREMENT,
    "code" TEXT NOT NULL,
    "title" TEXT NOT NULL,
    "product_id" INTEGER NOT NULL,
    "step" TEXT NOT NULL,
    "parameter" TEXT NOT NULL,
    "chamber" TEXT NULL,
    "chart_type" TEXT NOT NULL,
    "subgroup" TEXT NOT NULL,
    "rules" TEXT NOT NULL,
    "reaction_plan" TEXT NOT NULL,
    "electrical_concern_mv" REAL NOT NULL,
    "evaluated_through_batch_id" INTEGER NOT NULL,
    "created_at_ms" INTEGER NOT NULL,
    "updated_at_ms" INTEGER NOT NULL,
    CONSTRAINT "FK_chart_contexts_products_product_id" FOREIGN KEY ("product_id") REFERENCES "products" ("id") ON DELETE RESTRICT
);

CREATE TABLE "feed_events" (
    "seq" INTEGER NOT NULL CONSTRAINT "PK_feed_events" PRIMARY KEY AUTOINCREMENT,
    "at_ms" INTEGER NOT NULL,
    "kind" TEXT NOT NULL,
    "context_id" INTEGER NOT NULL,
    "payload" TEXT NOT NULL
);

CREATE TABLE "alerts" (
    "id" INTEGER NOT NULL CONSTRAINT "PK_alerts" PRIMARY KEY AUTOINCREMENT,
    "context_id" INTEGER NOT NULL,
    "rule" TEXT NOT NULL,
    "state" TEXT NOT NULL,
    "raised_at_ms" INTEGER NOT NULL,
    "updated_at_ms" INTEGER NOT NULL,
    "first_point_id" INTEGER NOT NULL,
    "last_point_id" INTEGER NOT NULL,
    "point_count" INTEGER NOT NULL,
    "lot_id" TEXT NOT NULL,
    "wafer_slot" INTEGER NULL,
    "chamber" TEXT NULL,
    "predicted_dvt_sat_mv" REAL NULL,
    "severity" TEXT NOT NULL,
    "severity_rank" INTEGER NOT NULL,
    "escalated_at_ms" INTEGER NULL,
    "acknowledged_by" TEXT NULL,
    "acknowledged_at_ms" INTEGER NULL,
    "closed_by" TEXT NULL,
    "closed_at_ms" INTEGER NULL,
    CONSTRAINT "FK_alerts_chart_contexts_context_id" FOREIGN KEY ("context_id") REFERENCES "chart_contexts" ("id") ON DELETE RESTRICT
);

CREATE TABLE "chart_points" (
    "id" INTEGER NOT NULL CONSTRAINT "PK_chart_points" PRIMARY KEY AUTOINCREMENT,
    "context_id" INTEGER NOT NULL,
    "seq" INTEGER NOT NULL,
    "batch_id" INTEGER NOT NULL,
    "measured_at_ms" INTEGER NOT NULL,
    "lot_id" TEXT NOT NULL,
    "wafer_slot" INTEGER NULL,
    "chamber" TEXT NULL,
    "value" REAL NOT NULL,
    "n" INTEGER NOT NULL,
    "sd" REAL NULL,
    "predicted_dvt_sat_mv" REAL NULL,
    "limit_version_id" INTEGER NULL,
    "z" REAL NULL,
    "signals" TEXT NOT NULL,
    CONSTRAINT "FK_chart_points_chart_contexts_context_id" FOREIGN KEY ("context_id") REFERENCES "chart_contexts" ("id") ON DELETE RESTRICT
);

CREATE TABLE "limit_versions" (
    "id" INTEGER NOT NULL CONSTRAINT "PK_limit_versions" PRIMARY KEY AUTOINCREMENT,
    "context_id" INTEGER NOT NULL,
    "version" INTEGER NOT NULL,
    "status" TEXT NOT NULL,
    "centre" REAL NOT NULL,
    "sigma" REAL NOT NULL,
    "subgroup_size" REAL NOT NULL,
    "points_used" INTEGER NOT NULL,
    "from_ms" INTEGER NOT NULL,
    "to_ms" INTEGER NOT NULL,
    "excluded_json" TEXT NOT NULL,
    "computed_by" TEXT NOT NULL,
    "computed_at_ms" INTEGER NOT NULL,
    "reason" TEXT NOT NULL,
    "approved_by" TEXT NULL,
    "approved_at_ms" INTEGER NULL,
    "approval_comment" TEXT NULL,
    "effective_from_ms" INTEGER NULL,
    CONSTRAINT "FK_limit_versions_chart_contexts_context_id" FOREIGN KEY ("context_id") REFERENCES "chart_contexts" ("id") ON DELETE RESTRICT
);

CREATE TABLE "alert_events" (
    "id" INTEGER NOT NULL CONSTRAINT "PK_alert_events" PRIMARY KEY AUTOINCREMENT,
    "alert_id" INTEGER NOT NULL,
    "kind" TEXT NOT NULL,
    "at_ms" INTEGER NOT NULL,
    "by" TEXT NOT NULL,
    "comment" TEXT NOT NULL,
    "steps_json" TEXT NULL,
    "point_id" INTEGER NULL,
    CONSTRAINT "FK_alert_events_alerts_alert_id" FOREIGN KEY ("alert_id") REFERENCES "alerts" ("id") ON DELETE RESTRICT
);

CREATE INDEX "IX_alert_events_alert_id" ON "alert_events" ("alert_id");

CREATE INDEX "IX_alerts_context_id_rule_state" ON "alerts" ("context_id", "rule", "state");

CREATE INDEX "IX_alerts_state" ON "alerts" ("state");

CREATE UNIQUE INDEX "IX_chart_contexts_code" ON "chart_contexts" ("code");

CREATE INDEX "IX_chart_contexts_product_id_step" ON "chart_contexts" ("product_id", "step");

CREATE INDEX "IX_chart_points_context_id_measured_at_ms" ON "chart_points" ("context_id", "measured_at_ms");

CREATE UNIQUE INDEX "IX_chart_points_context_id_seq" ON "chart_points" ("context_id", "seq");

CREATE INDEX "IX_feed_events_context_id_seq" ON "feed_events" ("context_id", "seq");

CREATE UNIQUE INDEX "IX_limit_versions_context_id_version" ON "limit_versions" ("context_id", "version");

INSERT INTO "__EFMigrationsHistory" ("MigrationId", "ProductVersion")
VALUES ('20261202111908_LiveMonitor', '10.0.15');

COMMIT;

BEGIN TRANSACTION;
DROP INDEX "IX_measurements_batch_id";

CREATE INDEX "IX_measurements_batch_id_product_id_step" ON "measurements" ("batch_id", "product_id", "step");

INSERT INTO "__EFMigrationsHistory" ("MigrationId", "ProductVersion")
VALUES ('20261202143009_MonitorBatchIndex', '10.0.15');

COMMIT;

BEGIN TRANSACTION;
CREATE TABLE "api_keys" (
    "id" INTEGER NOT NULL CONSTRAINT "PK_api_keys" PRIMARY KEY AUTOINCREMENT,
    "name" TEXT NOT NULL,
    "prefix" TEXT NOT NULL,
    "hash" TEXT NOT NULL,
    "scope" TEXT NOT NULL,
    "created_by" TEXT NOT NULL,
    "created_at_ms" INTEGER NOT NULL,
    "revoked_by" TEXT NULL,
    "revoked_at_ms" INTEGER NULL,
    "last_used_at_ms" INTEGER NULL
);

CREATE TABLE "audit_entries" (
    "id" INTEGER NOT NULL CONSTRAINT "PK_audit_entries" PRIMARY KEY AUTOINCREMENT,
    "at_ms" INTEGER NOT NULL,
    "by" TEXT NOT NULL,
    "entity" TEXT NOT NULL,
    "key" TEXT NOT NULL,
    "action" TEXT NOT NULL,
    "before_json" TEXT NULL,
    "after_json" TEXT NULL
);

CREATE TABLE "users" (
    "id" TEXT NOT NULL CONSTRAINT "PK_users" PRIMARY KEY,
    "role" TEXT NOT NULL,
    "created_at_ms" INTEGER NOT NULL,
    "disabled_at_ms" INTEGER NULL,
    "user_name" TEXT NULL,
    "normalized_user_name" TEXT NULL,
    "email" TEXT NULL,
    "normalized_email" TEXT NULL,
    "email_confirmed" INTEGER NOT NULL,
    "password_hash" TEXT NULL,
    "security_stamp" TEXT NULL,
    "concurrency_stamp" TEXT NULL,
    "phone_number" TEXT NULL,
    "phone_number_confirmed" INTEGER NOT NULL,
    "two_factor_enabled" INTEGER NOT NULL,
    "lockout_end" TEXT NULL,
    "lockout_enabled" INTEGER NOT NULL,
    "access_failed_count" INTEGER NOT NULL
);

CREATE TABLE "user_claims" (
    "id" INTEGER NOT NULL CONSTRAINT "PK_user_claims" PRIMARY KEY AUTOINCREMENT,
    "user_id" TEXT NOT NULL,
    "claim_type" TEXT NULL,
    "claim_value" TEXT NULL,
    CONSTRAINT "FK_user_claims_users_user_id" FOREIGN KEY ("user_id") REFERENCES "users" ("id") ON DELETE CASCADE
);

CREATE TABLE "user_logins" (
    "login_provider" TEXT NOT NULL,
    "provider_key" TEXT NOT NULL,
    "provider_display_name" TEXT NULL,
    "user_id" TEXT NOT NULL,
    CONSTRAINT "PK_user_logins" PRIMARY KEY ("login_provider", "provider_key"),
    CONSTRAINT "FK_user_logins_users_user_id" FOREIGN KEY ("user_id") REFERENCES "users" ("id") ON DELETE CASCADE
);

CREATE TABLE "user_tokens" (
    "user_id" TEXT NOT NULL,
    "login_provider" TEXT NOT NULL,
    "name" TEXT NOT NULL,
    "value" TEXT NULL,
    CONSTRAINT "PK_user_tokens" PRIMARY KEY ("user_id", "login_provider", "name"),
    CONSTRAINT "FK_user_tokens_users_user_id" FOREIGN KEY ("user_id") REFERENCES "users" ("id") ON DELETE CASCADE
);

CREATE UNIQUE INDEX "IX_api_keys_prefix" ON "api_keys" ("prefix");

CREATE INDEX "IX_audit_entries_at_ms" ON "audit_entries" ("at_ms");

CREATE INDEX "IX_audit_entries_entity_key" ON "audit_entries" ("entity", "key");

CREATE INDEX "IX_user_claims_user_id" ON "user_claims" ("user_id");

CREATE INDEX "IX_user_logins_user_id" ON "user_logins" ("user_id");

CREATE INDEX "EmailIndex" ON "users" ("normalized_email");

CREATE UNIQUE INDEX "UserNameIndex" ON "users" ("normalized_user_name");

CREATE TRIGGER audit_entries_no_update BEFORE UPDATE ON audit_entries BEGIN SELECT RAISE(ABORT, 'the audit trail is append-only'); END;

CREATE TRIGGER audit_entries_no_delete BEFORE DELETE ON audit_entries BEGIN SELECT RAISE(ABORT, 'the audit trail is append-only'); END;

INSERT INTO "__EFMigrationsHistory" ("MigrationId", "ProductVersion")
VALUES ('20261202150905_Access', '10.0.15');

COMMIT;

BEGIN TRANSACTION;
INSERT INTO "__EFMigrationsHistory" ("MigrationId", "ProductVersion")
VALUES ('20261202162301_CodeVersionLength', '10.0.15');

COMMIT;

BEGIN TRANSACTION;
CREATE INDEX "IX_measurements_series_order" ON "measurements" ("product_id", "step", "measured_at_ms", "lot_id", "wafer_slot", "site_id");

DROP INDEX "IX_measurements_product_id_step_measured_at_ms";

INSERT INTO "__EFMigrationsHistory" ("MigrationId", "ProductVersion")
VALUES ('20261202171545_SeriesOrderIndex', '10.0.15');

COMMIT;

BEGIN TRANSACTION;
UPDATE products SET gate_faces = 'tri-gate' WHERE gate_faces = 'TriGate';

UPDATE products SET gate_faces = 'double-gate' WHERE gate_faces = 'DoubleGate';

INSERT INTO "__EFMigrationsHistory" ("MigrationId", "ProductVersion")
VALUES ('20261205051840_GateFacesText', '10.0.15');

COMMIT;

BEGIN TRANSACTION;
CREATE TABLE "maintenance_events" (
    "id" INTEGER NOT NULL CONSTRAINT "PK_maintenance_events" PRIMARY KEY AUTOINCREMENT,
    "chamber" TEXT NOT NULL,
    "kind" TEXT NOT NULL,
    "occurred_at_ms" INTEGER NOT NULL,
    "performed_by" TEXT NOT NULL,
    "note" TEXT NOT NULL,
    "recorded_by" TEXT NOT NULL,
    "recorded_at_ms" INTEGER NOT NULL,
    "source" TEXT NOT NULL
);

CREATE INDEX "IX_maintenance_events_chamber_occurred_at_ms" ON "maintenance_events" ("chamber", "occurred_at_ms");

CREATE INDEX "IX_maintenance_events_occurred_at_ms" ON "maintenance_events" ("occurred_at_ms");

INSERT INTO "__EFMigrationsHistory" ("MigrationId", "ProductVersion")
VALUES ('20261205083213_AddMaintenanceEvents', '10.0.15');

COMMIT;

BEGIN TRANSACTION;
DROP INDEX "IX_alerts_context_id_rule_state";

ALTER TABLE "limit_versions" ADD "check_json" TEXT NULL;

ALTER TABLE "limit_versions" ADD "justification" TEXT NULL;

ALTER TABLE "limit_versions" ADD "verdict" TEXT NULL;

ALTER TABLE "alerts" ADD "back_in_control_at_ms" INTEGER NULL;

ALTER TABLE "alerts" ADD "first_seq" INTEGER NOT NULL DEFAULT 0;

ALTER TABLE "alerts" ADD "first_signal_at_ms" INTEGER NOT NULL DEFAULT 0;

ALTER TABLE "alerts" ADD "last_seq" INTEGER NOT NULL DEFAULT 0;

ALTER TABLE "alerts" ADD "last_signal_at_ms" INTEGER NOT NULL DEFAULT 0;

ALTER TABLE "alerts" ADD "last_signal_seq" INTEGER NOT NULL DEFAULT 0;

ALTER TABLE "alerts" ADD "lot_count" INTEGER NOT NULL DEFAULT 0;

ALTER TABLE "alerts" ADD "rules" TEXT NOT NULL DEFAULT '';

ALTER TABLE "alerts" ADD "signal_count" INTEGER NOT NULL DEFAULT 0;

ALTER TABLE "alerts" ADD "wafer_count" INTEGER NOT NULL DEFAULT 0;

CREATE INDEX "IX_alerts_context_id_state" ON "alerts" ("context_id", "state");

UPDATE alerts SET
    rules = rule,
    signal_count = point_count,
    first_seq = (SELECT p.seq FROM chart_points p WHERE p.id = alerts.first_point_id),
    last_seq = (SELECT p.seq FROM chart_points p WHERE p.id = alerts.last_point_id),
    last_signal_seq = (SELECT p.seq FROM chart_points p WHERE p.id = alerts.last_point_id),
    first_signal_at_ms = (SELECT p.measured_at_ms FROM chart_points p WHERE p.id = alerts.first_point_id),
    last_signal_at_ms = (SELECT p.measured_at_ms FROM chart_points p WHERE p.id = alerts.last_point_id);

UPDATE alerts SET
    point_count = (SELECT COUNT(*) FROM chart_points p WHERE p.context_id = alerts.context_id AND p.seq BETWEEN alerts.first_seq AND alerts.last_seq),
    lot_count = (SELECT COUNT(DISTINCT p.lot_id) FROM chart_points p WHERE p.context_id = alerts.context_id AND p.seq BETWEEN alerts.first_seq AND alerts.last_seq),
    wafer_count = (SELECT COUNT(DISTINCT p.lot_id || '/' || CAST(p.wafer_slot AS VARCHAR(12))) FROM chart_points p
                   WHERE p.context_id = alerts.context_id AND p.seq BETWEEN alerts.first_seq AND alerts.last_seq AND p.wafer_slot IS NOT NULL);

INSERT INTO "__EFMigrationsHistory" ("MigrationId", "ProductVersion")
VALUES ('20261205083257_ExcursionAlertsAndBaselineCheck', '10.0.15');

COMMIT;

BEGIN TRANSACTION;
CREATE TABLE "shift_handovers" (
    "id" INTEGER NOT NULL CONSTRAINT "PK_shift_handovers" PRIMARY KEY AUTOINCREMENT,
    "shift_date" TEXT NOT NULL,
    "shift" TEXT NOT NULL,
    "shift_start_ms" INTEGER NOT NULL,
    "notes" TEXT NOT NULL,
    "notes_by" TEXT NULL,
    "notes_at_ms" INTEGER NULL,
    "outgoing_by" TEXT NULL,
    "outgoing_at_ms" INTEGER NULL,
    "incoming_by" TEXT NULL,
    "incoming_at_ms" INTEGER NULL
);

CREATE UNIQUE INDEX "IX_shift_handovers_shift_date_shift" ON "shift_handovers" ("shift_date", "shift");

CREATE INDEX "IX_shift_handovers_shift_start_ms" ON "shift_handovers" ("shift_start_ms");

INSERT INTO "__EFMigrationsHistory" ("MigrationId", "ProductVersion")
VALUES ('20261205172141_ShiftHandovers', '10.0.15');

COMMIT;

BEGIN TRANSACTION;
CREATE TABLE "site_plan_sites" (
    "id" INTEGER NOT NULL CONSTRAINT "PK_site_plan_sites" PRIMARY KEY AUTOINCREMENT,
    "product_id" INTEGER NOT NULL,
    "step" TEXT NOT NULL,
    "position" INTEGER NOT NULL,
    "site_id" TEXT NOT NULL,
    "site_x_mm" REAL NOT NULL,
    "site_y_mm" REAL NOT NULL,
    "updated_at_ms" INTEGER NOT NULL,
    "updated_by" TEXT NOT NULL,
    CONSTRAINT "FK_site_plan_sites_products_product_id" FOREIGN KEY ("product_id") REFERENCES "products" ("id") ON DELETE CASCADE
);

CREATE UNIQUE INDEX "IX_site_plan_sites_product_id_step_position" ON "site_plan_sites" ("product_id", "step", "position");

CREATE UNIQUE INDEX "IX_site_plan_sites_product_id_step_site_id" ON "site_plan_sites" ("product_id", "step", "site_id");

INSERT INTO "__EFMigrationsHistory" ("MigrationId", "ProductVersion")
VALUES ('20261205184747_AddSitePlans', '10.0.15');

COMMIT;

BEGIN TRANSACTION;
ALTER TABLE "alerts" ADD "escalated_to" TEXT NULL;

ALTER TABLE "alerts" ADD "escalation_level" INTEGER NOT NULL DEFAULT 0;

CREATE TABLE "notification_outbox" (
    "id" INTEGER NOT NULL CONSTRAINT "PK_notification_outbox" PRIMARY KEY AUTOINCREMENT,
    "key" TEXT NOT NULL,
    "alert_id" INTEGER NOT NULL,
    "event" TEXT NOT NULL,
    "channel" TEXT NOT NULL,
    "target" TEXT NOT NULL,
    "recipient" TEXT NULL,
    "payload" TEXT NOT NULL,
    "status" TEXT NOT NULL,
    "attempts" INTEGER NOT NULL,
    "created_at_ms" INTEGER NOT NULL,
    "next_attempt_at_ms" INTEGER NOT NULL,
    "claimed_by" TEXT NULL,
    "claimed_until_ms" INTEGER NULL,
    "sent_at_ms" INTEGER NULL,
    "last_error" TEXT NULL,
    CONSTRAINT "FK_notification_outbox_alerts_alert_id" FOREIGN KEY ("alert_id") REFERENCES "alerts" ("id") ON DELETE RESTRICT
);

CREATE TABLE "notification_rules" (
    "id" INTEGER NOT NULL CONSTRAINT "PK_notification_rules" PRIMARY KEY AUTOINCREMENT,
    "owner" TEXT NOT NULL,
    "channel" TEXT NOT NULL,
    "webhook" TEXT NULL,
    "min_severity" TEXT NOT NULL,
    "min_severity_rank" INTEGER NOT NULL,
    "product" TEXT NULL,
    "step" TEXT NULL,
    "equipment" TEXT NULL,
    "context" TEXT NULL,
    "created_at_ms" INTEGER NOT NULL,
    "created_by" TEXT NOT NULL
);

CREATE TABLE "shift_roster" (
    "id" INTEGER NOT NULL CONSTRAINT "PK_shift_roster" PRIMARY KEY AUTOINCREMENT,
    "shift" TEXT NOT NULL,
    "person" TEXT NOT NULL,
    "from_date" TEXT NOT NULL,
    "to_date" TEXT NULL
);

CREATE TABLE "notification_deliveries" (
    "id" INTEGER NOT NULL CONSTRAINT "PK_notification_deliveries" PRIMARY KEY AUTOINCREMENT,
    "message_id" INTEGER NOT NULL,
    "alert_id" INTEGER NOT NULL,
    "attempt" INTEGER NOT NULL,
    "at_ms" INTEGER NOT NULL,
    "duration_ms" INTEGER NOT NULL,
    "outcome" TEXT NOT NULL,
    "detail" TEXT NOT NULL,
    "by" TEXT NOT NULL,
    CONSTRAINT "FK_notification_deliveries_notification_outbox_message_id" FOREIGN KEY ("message_id") REFERENCES "notification_outbox" ("id") ON DELETE RESTRICT
);

CREATE INDEX "IX_notification_deliveries_alert_id" ON "notification_deliveries" ("alert_id");

CREATE INDEX "IX_notification_deliveries_message_id" ON "notification_deliveries" ("message_id");

CREATE INDEX "IX_notification_outbox_alert_id" ON "notification_outbox" ("alert_id");

CREATE UNIQUE INDEX "IX_notification_outbox_key" ON "notification_outbox" ("key");

CREATE INDEX "IX_notification_outbox_status_next_attempt_at_ms" ON "notification_outbox" ("status", "next_attempt_at_ms");

CREATE INDEX "IX_notification_rules_owner" ON "notification_rules" ("owner");

CREATE INDEX "IX_shift_roster_shift" ON "shift_roster" ("shift");

UPDATE alerts SET escalation_level = 1 WHERE escalated_at_ms IS NOT NULL

INSERT INTO "__EFMigrationsHistory" ("MigrationId", "ProductVersion")
VALUES ('20261205235920_Notifications', '10.0.15');

COMMIT;

