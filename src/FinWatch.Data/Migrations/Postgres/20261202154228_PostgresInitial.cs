using System;
using Microsoft.EntityFrameworkCore.Migrations;
using Npgsql.EntityFrameworkCore.PostgreSQL.Metadata;

#nullable disable

namespace FinWatch.Data.Migrations.Postgres
{
    /// <inheritdoc />
    public partial class PostgresInitial : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.CreateTable(
                name: "api_keys",
                columns: table => new
                {
                    id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    name = table.Column<string>(type: "character varying(100)", maxLength: 100, nullable: false),
                    prefix = table.Column<string>(type: "character varying(32)", maxLength: 32, nullable: false),
                    hash = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    scope = table.Column<string>(type: "character varying(16)", maxLength: 16, nullable: false),
                    created_by = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false),
                    created_at_ms = table.Column<long>(type: "bigint", nullable: false),
                    revoked_by = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: true),
                    revoked_at_ms = table.Column<long>(type: "bigint", nullable: true),
                    last_used_at_ms = table.Column<long>(type: "bigint", nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_api_keys", x => x.id);
                });

            migrationBuilder.CreateTable(
                name: "audit_entries",
                columns: table => new
                {
                    id = table.Column<long>(type: "bigint", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    at_ms = table.Column<long>(type: "bigint", nullable: false),
                    by = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false),
                    entity = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    key = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false),
                    action = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    before_json = table.Column<string>(type: "text", nullable: true),
                    after_json = table.Column<string>(type: "text", nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_audit_entries", x => x.id);
                });

            migrationBuilder.CreateTable(
                name: "feed_events",
                columns: table => new
                {
                    seq = table.Column<long>(type: "bigint", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    at_ms = table.Column<long>(type: "bigint", nullable: false),
                    kind = table.Column<string>(type: "character varying(16)", maxLength: 16, nullable: false),
                    context_id = table.Column<int>(type: "integer", nullable: false),
                    payload = table.Column<string>(type: "text", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_feed_events", x => x.seq);
                });

            migrationBuilder.CreateTable(
                name: "ingest_batches",
                columns: table => new
                {
                    id = table.Column<long>(type: "bigint", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    source = table.Column<string>(type: "character varying(16)", maxLength: 16, nullable: false),
                    label = table.Column<string>(type: "character varying(260)", maxLength: 260, nullable: true),
                    received_at_ms = table.Column<long>(type: "bigint", nullable: false),
                    completed_at_ms = table.Column<long>(type: "bigint", nullable: false),
                    row_count = table.Column<int>(type: "integer", nullable: false),
                    inserted = table.Column<int>(type: "integer", nullable: false),
                    already_present = table.Column<int>(type: "integer", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_ingest_batches", x => x.id);
                });

            migrationBuilder.CreateTable(
                name: "lot_chambers",
                columns: table => new
                {
                    lot_id = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    step = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    chamber = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_lot_chambers", x => new { x.lot_id, x.step, x.chamber });
                });

            migrationBuilder.CreateTable(
                name: "products",
                columns: table => new
                {
                    id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    code = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    name = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false),
                    description = table.Column<string>(type: "character varying(2000)", maxLength: 2000, nullable: false),
                    gate_faces = table.Column<string>(type: "character varying(16)", maxLength: 16, nullable: false),
                    nominal_top_width_nm = table.Column<double>(type: "double precision", nullable: false),
                    nominal_bottom_width_nm = table.Column<double>(type: "double precision", nullable: false),
                    nominal_fin_height_nm = table.Column<double>(type: "double precision", nullable: false),
                    nominal_corner_radius_nm = table.Column<double>(type: "double precision", nullable: false),
                    nominal_liner_thickness_nm = table.Column<double>(type: "double precision", nullable: false),
                    model_eot_nm = table.Column<double>(type: "double precision", nullable: false, defaultValue: 0.90000000000000002),
                    model_gate_length_nm = table.Column<double>(type: "double precision", nullable: false, defaultValue: 20.0),
                    model_channel_doping_cm3 = table.Column<double>(type: "double precision", nullable: false, defaultValue: 1E+17),
                    model_sidewall_orientation = table.Column<string>(type: "character varying(8)", maxLength: 8, nullable: false, defaultValue: "110"),
                    created_at_ms = table.Column<long>(type: "bigint", nullable: false),
                    updated_at_ms = table.Column<long>(type: "bigint", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_products", x => x.id);
                });

            migrationBuilder.CreateTable(
                name: "users",
                columns: table => new
                {
                    id = table.Column<string>(type: "text", nullable: false),
                    role = table.Column<string>(type: "character varying(16)", maxLength: 16, nullable: false),
                    created_at_ms = table.Column<long>(type: "bigint", nullable: false),
                    disabled_at_ms = table.Column<long>(type: "bigint", nullable: true),
                    user_name = table.Column<string>(type: "character varying(256)", maxLength: 256, nullable: true),
                    normalized_user_name = table.Column<string>(type: "character varying(256)", maxLength: 256, nullable: true),
                    email = table.Column<string>(type: "character varying(256)", maxLength: 256, nullable: true),
                    normalized_email = table.Column<string>(type: "character varying(256)", maxLength: 256, nullable: true),
                    email_confirmed = table.Column<bool>(type: "boolean", nullable: false),
                    password_hash = table.Column<string>(type: "text", nullable: true),
                    security_stamp = table.Column<string>(type: "text", nullable: true),
                    concurrency_stamp = table.Column<string>(type: "text", nullable: true),
                    phone_number = table.Column<string>(type: "text", nullable: true),
                    phone_number_confirmed = table.Column<bool>(type: "boolean", nullable: false),
                    two_factor_enabled = table.Column<bool>(type: "boolean", nullable: false),
                    lockout_end = table.Column<DateTimeOffset>(type: "timestamp with time zone", nullable: true),
                    lockout_enabled = table.Column<bool>(type: "boolean", nullable: false),
                    access_failed_count = table.Column<int>(type: "integer", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_users", x => x.id);
                });

            migrationBuilder.CreateTable(
                name: "chart_contexts",
                columns: table => new
                {
                    id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    code = table.Column<string>(type: "character varying(100)", maxLength: 100, nullable: false),
                    title = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false),
                    product_id = table.Column<int>(type: "integer", nullable: false),
                    step = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    parameter = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    chamber = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: true),
                    chart_type = table.Column<string>(type: "character varying(16)", maxLength: 16, nullable: false),
                    subgroup = table.Column<string>(type: "character varying(16)", maxLength: 16, nullable: false),
                    rules = table.Column<string>(type: "character varying(100)", maxLength: 100, nullable: false),
                    reaction_plan = table.Column<string>(type: "character varying(8000)", maxLength: 8000, nullable: false),
                    electrical_concern_mv = table.Column<double>(type: "double precision", nullable: false),
                    evaluated_through_batch_id = table.Column<long>(type: "bigint", nullable: false),
                    created_at_ms = table.Column<long>(type: "bigint", nullable: false),
                    updated_at_ms = table.Column<long>(type: "bigint", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_chart_contexts", x => x.id);
                    table.ForeignKey(
                        name: "FK_chart_contexts_products_product_id",
                        column: x => x.product_id,
                        principalTable: "products",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "lot_steps",
                columns: table => new
                {
                    lot_id = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    step = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    product_id = table.Column<int>(type: "integer", nullable: false),
                    first_measured_at_ms = table.Column<long>(type: "bigint", nullable: false),
                    last_measured_at_ms = table.Column<long>(type: "bigint", nullable: false),
                    wafer_count = table.Column<int>(type: "integer", nullable: false),
                    site_count = table.Column<int>(type: "integer", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_lot_steps", x => new { x.lot_id, x.step });
                    table.ForeignKey(
                        name: "FK_lot_steps_products_product_id",
                        column: x => x.product_id,
                        principalTable: "products",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "measurements",
                columns: table => new
                {
                    id = table.Column<long>(type: "bigint", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    batch_id = table.Column<long>(type: "bigint", nullable: false),
                    lot_id = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    wafer_slot = table.Column<int>(type: "integer", nullable: false),
                    site_id = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    site_x_mm = table.Column<double>(type: "double precision", nullable: false),
                    site_y_mm = table.Column<double>(type: "double precision", nullable: false),
                    product_id = table.Column<int>(type: "integer", nullable: false),
                    step = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    etch_tool = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: true),
                    etch_chamber = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: true),
                    liner_tool = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: true),
                    liner_chamber = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: true),
                    metrology_tool = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: true),
                    @operator = table.Column<string>(name: "operator", type: "character varying(64)", maxLength: 64, nullable: true),
                    measured_at_ms = table.Column<long>(type: "bigint", nullable: false),
                    top_width_nm = table.Column<double>(type: "double precision", nullable: true),
                    bottom_width_nm = table.Column<double>(type: "double precision", nullable: true),
                    fin_height_nm = table.Column<double>(type: "double precision", nullable: true),
                    corner_radius_nm = table.Column<double>(type: "double precision", nullable: true),
                    liner_thickness_nm = table.Column<double>(type: "double precision", nullable: true),
                    taper_deg = table.Column<double>(type: "double precision", nullable: true),
                    mid_width_nm = table.Column<double>(type: "double precision", nullable: true),
                    area_nm2 = table.Column<double>(type: "double precision", nullable: true),
                    gated_perimeter_nm = table.Column<double>(type: "double precision", nullable: true),
                    max_corner_radius_nm = table.Column<double>(type: "double precision", nullable: true),
                    delta_vt_lin_mv = table.Column<double>(type: "double precision", nullable: true),
                    delta_vt_sat_mv = table.Column<double>(type: "double precision", nullable: true),
                    delta_swing_lin_mv_per_dec = table.Column<double>(type: "double precision", nullable: true),
                    delta_dibl_mv_per_v = table.Column<double>(type: "double precision", nullable: true),
                    model_stamp_id = table.Column<int>(type: "integer", nullable: true),
                    flags = table.Column<int>(type: "integer", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_measurements", x => x.id);
                    table.ForeignKey(
                        name: "FK_measurements_ingest_batches_batch_id",
                        column: x => x.batch_id,
                        principalTable: "ingest_batches",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                    table.ForeignKey(
                        name: "FK_measurements_products_product_id",
                        column: x => x.product_id,
                        principalTable: "products",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "model_parameter_sets",
                columns: table => new
                {
                    id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    product_id = table.Column<int>(type: "integer", nullable: false),
                    version = table.Column<int>(type: "integer", nullable: false),
                    gate_length_nm = table.Column<double>(type: "double precision", nullable: false),
                    gate_length_sd_nm = table.Column<double>(type: "double precision", nullable: false),
                    barrier_height_v = table.Column<double>(type: "double precision", nullable: false),
                    barrier_height_sd_v = table.Column<double>(type: "double precision", nullable: false),
                    threshold_offset_v = table.Column<double>(type: "double precision", nullable: false),
                    threshold_offset_sd_v = table.Column<double>(type: "double precision", nullable: false),
                    rms_residual_before_mv = table.Column<double>(type: "double precision", nullable: false),
                    rms_residual_after_mv = table.Column<double>(type: "double precision", nullable: false),
                    measurement_sd_mv = table.Column<double>(type: "double precision", nullable: false),
                    observations = table.Column<int>(type: "integer", nullable: false),
                    iterations = table.Column<int>(type: "integer", nullable: false),
                    code_version = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    created_at_ms = table.Column<long>(type: "bigint", nullable: false),
                    created_by = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false),
                    reason = table.Column<string>(type: "character varying(2000)", maxLength: 2000, nullable: false),
                    source_name = table.Column<string>(type: "character varying(260)", maxLength: 260, nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_model_parameter_sets", x => x.id);
                    table.ForeignKey(
                        name: "FK_model_parameter_sets_products_product_id",
                        column: x => x.product_id,
                        principalTable: "products",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "model_stamps",
                columns: table => new
                {
                    id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    product_id = table.Column<int>(type: "integer", nullable: false),
                    parameter_set = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false),
                    parameter_set_version = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false),
                    code_version = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_model_stamps", x => x.id);
                    table.ForeignKey(
                        name: "FK_model_stamps_products_product_id",
                        column: x => x.product_id,
                        principalTable: "products",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "spec_limits",
                columns: table => new
                {
                    id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    product_id = table.Column<int>(type: "integer", nullable: false),
                    parameter = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    lower = table.Column<double>(type: "double precision", nullable: true),
                    target = table.Column<double>(type: "double precision", nullable: true),
                    upper = table.Column<double>(type: "double precision", nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_spec_limits", x => x.id);
                    table.ForeignKey(
                        name: "FK_spec_limits_products_product_id",
                        column: x => x.product_id,
                        principalTable: "products",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Cascade);
                });

            migrationBuilder.CreateTable(
                name: "user_claims",
                columns: table => new
                {
                    id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    user_id = table.Column<string>(type: "text", nullable: false),
                    claim_type = table.Column<string>(type: "text", nullable: true),
                    claim_value = table.Column<string>(type: "text", nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_user_claims", x => x.id);
                    table.ForeignKey(
                        name: "FK_user_claims_users_user_id",
                        column: x => x.user_id,
                        principalTable: "users",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Cascade);
                });

            migrationBuilder.CreateTable(
                name: "user_logins",
                columns: table => new
                {
                    login_provider = table.Column<string>(type: "text", nullable: false),
                    provider_key = table.Column<string>(type: "text", nullable: false),
                    provider_display_name = table.Column<string>(type: "text", nullable: true),
                    user_id = table.Column<string>(type: "text", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_user_logins", x => new { x.login_provider, x.provider_key });
                    table.ForeignKey(
                        name: "FK_user_logins_users_user_id",
                        column: x => x.user_id,
                        principalTable: "users",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Cascade);
                });

            migrationBuilder.CreateTable(
                name: "user_tokens",
                columns: table => new
                {
                    user_id = table.Column<string>(type: "text", nullable: false),
                    login_provider = table.Column<string>(type: "text", nullable: false),
                    name = table.Column<string>(type: "text", nullable: false),
                    value = table.Column<string>(type: "text", nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_user_tokens", x => new { x.user_id, x.login_provider, x.name });
                    table.ForeignKey(
                        name: "FK_user_tokens_users_user_id",
                        column: x => x.user_id,
                        principalTable: "users",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Cascade);
                });

            migrationBuilder.CreateTable(
                name: "alerts",
                columns: table => new
                {
                    id = table.Column<long>(type: "bigint", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    context_id = table.Column<int>(type: "integer", nullable: false),
                    rule = table.Column<string>(type: "character varying(8)", maxLength: 8, nullable: false),
                    state = table.Column<string>(type: "character varying(16)", maxLength: 16, nullable: false),
                    raised_at_ms = table.Column<long>(type: "bigint", nullable: false),
                    updated_at_ms = table.Column<long>(type: "bigint", nullable: false),
                    first_point_id = table.Column<long>(type: "bigint", nullable: false),
                    last_point_id = table.Column<long>(type: "bigint", nullable: false),
                    point_count = table.Column<int>(type: "integer", nullable: false),
                    lot_id = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    wafer_slot = table.Column<int>(type: "integer", nullable: true),
                    chamber = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: true),
                    predicted_dvt_sat_mv = table.Column<double>(type: "double precision", nullable: true),
                    severity = table.Column<string>(type: "character varying(16)", maxLength: 16, nullable: false),
                    severity_rank = table.Column<int>(type: "integer", nullable: false),
                    escalated_at_ms = table.Column<long>(type: "bigint", nullable: true),
                    acknowledged_by = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: true),
                    acknowledged_at_ms = table.Column<long>(type: "bigint", nullable: true),
                    closed_by = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: true),
                    closed_at_ms = table.Column<long>(type: "bigint", nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_alerts", x => x.id);
                    table.ForeignKey(
                        name: "FK_alerts_chart_contexts_context_id",
                        column: x => x.context_id,
                        principalTable: "chart_contexts",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "chart_points",
                columns: table => new
                {
                    id = table.Column<long>(type: "bigint", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    context_id = table.Column<int>(type: "integer", nullable: false),
                    seq = table.Column<long>(type: "bigint", nullable: false),
                    batch_id = table.Column<long>(type: "bigint", nullable: false),
                    measured_at_ms = table.Column<long>(type: "bigint", nullable: false),
                    lot_id = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    wafer_slot = table.Column<int>(type: "integer", nullable: true),
                    chamber = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: true),
                    value = table.Column<double>(type: "double precision", nullable: false),
                    n = table.Column<int>(type: "integer", nullable: false),
                    sd = table.Column<double>(type: "double precision", nullable: true),
                    predicted_dvt_sat_mv = table.Column<double>(type: "double precision", nullable: true),
                    limit_version_id = table.Column<int>(type: "integer", nullable: true),
                    z = table.Column<double>(type: "double precision", nullable: true),
                    signals = table.Column<string>(type: "character varying(100)", maxLength: 100, nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_chart_points", x => x.id);
                    table.ForeignKey(
                        name: "FK_chart_points_chart_contexts_context_id",
                        column: x => x.context_id,
                        principalTable: "chart_contexts",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "limit_versions",
                columns: table => new
                {
                    id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    context_id = table.Column<int>(type: "integer", nullable: false),
                    version = table.Column<int>(type: "integer", nullable: false),
                    status = table.Column<string>(type: "character varying(16)", maxLength: 16, nullable: false),
                    centre = table.Column<double>(type: "double precision", nullable: false),
                    sigma = table.Column<double>(type: "double precision", nullable: false),
                    subgroup_size = table.Column<double>(type: "double precision", nullable: false),
                    points_used = table.Column<int>(type: "integer", nullable: false),
                    from_ms = table.Column<long>(type: "bigint", nullable: false),
                    to_ms = table.Column<long>(type: "bigint", nullable: false),
                    excluded_json = table.Column<string>(type: "text", nullable: false),
                    computed_by = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false),
                    computed_at_ms = table.Column<long>(type: "bigint", nullable: false),
                    reason = table.Column<string>(type: "character varying(2000)", maxLength: 2000, nullable: false),
                    approved_by = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: true),
                    approved_at_ms = table.Column<long>(type: "bigint", nullable: true),
                    approval_comment = table.Column<string>(type: "character varying(2000)", maxLength: 2000, nullable: true),
                    effective_from_ms = table.Column<long>(type: "bigint", nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_limit_versions", x => x.id);
                    table.ForeignKey(
                        name: "FK_limit_versions_chart_contexts_context_id",
                        column: x => x.context_id,
                        principalTable: "chart_contexts",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "electrical_tests",
                columns: table => new
                {
                    id = table.Column<long>(type: "bigint", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    parameter_set_id = table.Column<int>(type: "integer", nullable: false),
                    product_id = table.Column<int>(type: "integer", nullable: false),
                    lot_id = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    wafer_slot = table.Column<int>(type: "integer", nullable: false),
                    vt_lin_v = table.Column<double>(type: "double precision", nullable: false),
                    vt_sat_v = table.Column<double>(type: "double precision", nullable: false),
                    tested_at_ms = table.Column<long>(type: "bigint", nullable: false),
                    mean_top_width_nm = table.Column<double>(type: "double precision", nullable: false),
                    mean_bottom_width_nm = table.Column<double>(type: "double precision", nullable: false),
                    mean_fin_height_nm = table.Column<double>(type: "double precision", nullable: false),
                    mean_corner_radius_nm = table.Column<double>(type: "double precision", nullable: false),
                    sites = table.Column<int>(type: "integer", nullable: false),
                    residual_lin_mv = table.Column<double>(type: "double precision", nullable: false),
                    residual_sat_mv = table.Column<double>(type: "double precision", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_electrical_tests", x => x.id);
                    table.ForeignKey(
                        name: "FK_electrical_tests_model_parameter_sets_parameter_set_id",
                        column: x => x.parameter_set_id,
                        principalTable: "model_parameter_sets",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                    table.ForeignKey(
                        name: "FK_electrical_tests_products_product_id",
                        column: x => x.product_id,
                        principalTable: "products",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "alert_events",
                columns: table => new
                {
                    id = table.Column<long>(type: "bigint", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    alert_id = table.Column<long>(type: "bigint", nullable: false),
                    kind = table.Column<string>(type: "character varying(32)", maxLength: 32, nullable: false),
                    at_ms = table.Column<long>(type: "bigint", nullable: false),
                    by = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false),
                    comment = table.Column<string>(type: "character varying(4000)", maxLength: 4000, nullable: false),
                    steps_json = table.Column<string>(type: "text", nullable: true),
                    point_id = table.Column<long>(type: "bigint", nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_alert_events", x => x.id);
                    table.ForeignKey(
                        name: "FK_alert_events_alerts_alert_id",
                        column: x => x.alert_id,
                        principalTable: "alerts",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateIndex(
                name: "IX_alert_events_alert_id",
                table: "alert_events",
                column: "alert_id");

            migrationBuilder.CreateIndex(
                name: "IX_alerts_context_id_rule_state",
                table: "alerts",
                columns: new[] { "context_id", "rule", "state" });

            migrationBuilder.CreateIndex(
                name: "IX_alerts_state",
                table: "alerts",
                column: "state");

            migrationBuilder.CreateIndex(
                name: "IX_api_keys_prefix",
                table: "api_keys",
                column: "prefix",
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_audit_entries_at_ms",
                table: "audit_entries",
                column: "at_ms");

            migrationBuilder.CreateIndex(
                name: "IX_audit_entries_entity_key",
                table: "audit_entries",
                columns: new[] { "entity", "key" });

            migrationBuilder.CreateIndex(
                name: "IX_chart_contexts_code",
                table: "chart_contexts",
                column: "code",
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_chart_contexts_product_id_step",
                table: "chart_contexts",
                columns: new[] { "product_id", "step" });

            migrationBuilder.CreateIndex(
                name: "IX_chart_points_context_id_measured_at_ms",
                table: "chart_points",
                columns: new[] { "context_id", "measured_at_ms" });

            migrationBuilder.CreateIndex(
                name: "IX_chart_points_context_id_seq",
                table: "chart_points",
                columns: new[] { "context_id", "seq" },
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_electrical_tests_lot_id_wafer_slot",
                table: "electrical_tests",
                columns: new[] { "lot_id", "wafer_slot" });

            migrationBuilder.CreateIndex(
                name: "IX_electrical_tests_parameter_set_id",
                table: "electrical_tests",
                column: "parameter_set_id");

            migrationBuilder.CreateIndex(
                name: "IX_electrical_tests_product_id",
                table: "electrical_tests",
                column: "product_id");

            migrationBuilder.CreateIndex(
                name: "IX_feed_events_context_id_seq",
                table: "feed_events",
                columns: new[] { "context_id", "seq" });

            migrationBuilder.CreateIndex(
                name: "IX_limit_versions_context_id_version",
                table: "limit_versions",
                columns: new[] { "context_id", "version" },
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_lot_chambers_chamber",
                table: "lot_chambers",
                column: "chamber");

            migrationBuilder.CreateIndex(
                name: "IX_lot_steps_last_measured_at_ms",
                table: "lot_steps",
                column: "last_measured_at_ms");

            migrationBuilder.CreateIndex(
                name: "IX_lot_steps_product_id",
                table: "lot_steps",
                column: "product_id");

            migrationBuilder.CreateIndex(
                name: "IX_measurements_batch_id_product_id_step",
                table: "measurements",
                columns: new[] { "batch_id", "product_id", "step" });

            migrationBuilder.CreateIndex(
                name: "IX_measurements_lot_id_wafer_slot_site_id_step_measured_at_ms",
                table: "measurements",
                columns: new[] { "lot_id", "wafer_slot", "site_id", "step", "measured_at_ms" },
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_measurements_product_id_step_measured_at_ms",
                table: "measurements",
                columns: new[] { "product_id", "step", "measured_at_ms" });

            migrationBuilder.CreateIndex(
                name: "IX_model_parameter_sets_product_id_version",
                table: "model_parameter_sets",
                columns: new[] { "product_id", "version" },
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_model_stamps_product_id_parameter_set_parameter_set_version~",
                table: "model_stamps",
                columns: new[] { "product_id", "parameter_set", "parameter_set_version", "code_version" },
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_products_code",
                table: "products",
                column: "code",
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_spec_limits_product_id_parameter",
                table: "spec_limits",
                columns: new[] { "product_id", "parameter" },
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_user_claims_user_id",
                table: "user_claims",
                column: "user_id");

            migrationBuilder.CreateIndex(
                name: "IX_user_logins_user_id",
                table: "user_logins",
                column: "user_id");

            migrationBuilder.CreateIndex(
                name: "EmailIndex",
                table: "users",
                column: "normalized_email");

            migrationBuilder.CreateIndex(
                name: "UserNameIndex",
                table: "users",
                column: "normalized_user_name",
                unique: true);

            // The audit trail is append-only: the database itself refuses to change or remove an entry (the SQLite set
            // does the same with RAISE(ABORT) triggers in its Access migration).
            migrationBuilder.Sql("""
                CREATE FUNCTION audit_entries_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
                BEGIN RAISE EXCEPTION 'the audit trail is append-only'; END; $$;
                """);
            migrationBuilder.Sql("CREATE TRIGGER audit_entries_no_update BEFORE UPDATE ON audit_entries FOR EACH ROW EXECUTE FUNCTION audit_entries_append_only();");
            migrationBuilder.Sql("CREATE TRIGGER audit_entries_no_delete BEFORE DELETE ON audit_entries FOR EACH ROW EXECUTE FUNCTION audit_entries_append_only();");
            migrationBuilder.Sql("CREATE TRIGGER audit_entries_no_truncate BEFORE TRUNCATE ON audit_entries FOR EACH STATEMENT EXECUTE FUNCTION audit_entries_append_only();");
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.Sql("DROP TRIGGER IF EXISTS audit_entries_no_update ON audit_entries;");
            migrationBuilder.Sql("DROP TRIGGER IF EXISTS audit_entries_no_delete ON audit_entries;");
            migrationBuilder.Sql("DROP TRIGGER IF EXISTS audit_entries_no_truncate ON audit_entries;");
            migrationBuilder.Sql("DROP FUNCTION IF EXISTS audit_entries_append_only();");

            migrationBuilder.DropTable(
                name: "alert_events");

            migrationBuilder.DropTable(
                name: "api_keys");

            migrationBuilder.DropTable(
                name: "audit_entries");

            migrationBuilder.DropTable(
                name: "chart_points");

            migrationBuilder.DropTable(
                name: "electrical_tests");

            migrationBuilder.DropTable(
                name: "feed_events");

            migrationBuilder.DropTable(
                name: "limit_versions");

            migrationBuilder.DropTable(
                name: "lot_chambers");

            migrationBuilder.DropTable(
                name: "lot_steps");

            migrationBuilder.DropTable(
                name: "measurements");

            migrationBuilder.DropTable(
                name: "model_stamps");

            migrationBuilder.DropTable(
                name: "spec_limits");

            migrationBuilder.DropTable(
                name: "user_claims");

            migrationBuilder.DropTable(
                name: "user_logins");

            migrationBuilder.DropTable(
                name: "user_tokens");

            migrationBuilder.DropTable(
                name: "alerts");

            migrationBuilder.DropTable(
                name: "model_parameter_sets");

            migrationBuilder.DropTable(
                name: "ingest_batches");

            migrationBuilder.DropTable(
                name: "users");

            migrationBuilder.DropTable(
                name: "chart_contexts");

            migrationBuilder.DropTable(
                name: "products");
        }
    }
}
