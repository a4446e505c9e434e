import { DataTypes, Sequelize } from "sequelize";
import type { Migration } from "../migrator";

const now = { type: DataTypes.DATE, allowNull: false, defaultValue: Sequelize.fn("now") };
const id = { type: DataTypes.UUID, primaryKey: true, defaultValue: Sequelize.literal("gen_random_uuid()") };
const ref = (table: string, onDelete = "CASCADE", allowNull = false) => ({
  type: DataTypes.UUID,
  allowNull,
  references: { model: table, key: "id" },
  onDelete,
});

// Bidding, questions, awarded jobs and their milestones.
export const up: Migration = async ({ context: qi }) => {
  // What shops filter open specs by, copied from the current revision when it is published so
  // the list needs no JSON digging: the relief setting and pump flow of the design, the units
  // wanted and the currency every bid on the spec is made in.
  await qi.addColumn("specs", "currency", { type: DataTypes.STRING(3), allowNull: false, defaultValue: "EUR" });
  await qi.addColumn("specs", "units_wanted", { type: DataTypes.INTEGER, allowNull: true });
  await qi.addColumn("specs", "relief_setting_bar", { type: DataTypes.REAL, allowNull: true });
  await qi.addColumn("specs", "pump_flow_lpm", { type: DataTypes.REAL, allowNull: true });
  // The open-specs table at 100 000 specs: a partial index serves "open, deadline ahead" in
  // deadline order; trigram indexes serve the substring searches on title and region.
  await qi.sequelize.query("CREATE EXTENSION IF NOT EXISTS pg_trgm");
  await qi.sequelize.query("CREATE INDEX specs_open_deadline ON specs (bid_deadline, id) WHERE status = 'open'");
  await qi.sequelize.query("CREATE INDEX specs_open_published ON specs (published_at DESC, id) WHERE status = 'open'");
  await qi.sequelize.query("CREATE INDEX specs_open_pressure ON specs (relief_setting_bar) WHERE status = 'open'");
  await qi.sequelize.query("CREATE INDEX specs_open_flow ON specs (pump_flow_lpm) WHERE status = 'open'");
  await qi.sequelize.query("CREATE INDEX specs_title_trgm ON specs USING gin (title gin_trgm_ops)");
  await qi.sequelize.query("CREATE INDEX specs_region_trgm ON specs USING gin (delivery_region gin_trgm_ops)");

  await qi.createTable("spec_questions", {
    id,
    spec_id: ref("specs"),
    /** The asking shop: shown to the buyer, never to other shops. */
    organisation_id: ref("organisations"),
    asked_by_id: ref("users", "RESTRICT"),
    body: { type: DataTypes.TEXT, allowNull: false },
    answer: { type: DataTypes.TEXT, allowNull: true },
    answered_by_id: ref("users", "RESTRICT", true),
    answered_at: { type: DataTypes.DATE, allowNull: true },
    created_at: now,
    updated_at: now,
  });
  await qi.addIndex("spec_questions", ["spec_id", "created_at"]);

  // One bid per shop organisation and spec; each submission is kept in bid_versions.
  await qi.createTable("bids", {
    id,
    spec_id: ref("specs"),
    organisation_id: ref("organisations"),
    created_by_id: ref("users", "RESTRICT"),
    status: { type: DataTypes.ENUM("draft", "submitted", "withdrawn", "won", "not_selected"), allowNull: false, defaultValue: "draft" },
    /** The spec revision the current offer was made against. */
    spec_revision: { type: DataTypes.INTEGER, allowNull: false },
    /** How many times it has been submitted: the number of its latest version. */
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    currency: { type: DataTypes.STRING(3), allowNull: false },
    /** [{ key, item, quantity, specification, unitPriceCents, alternative, alternativeDescription }] */
    lines: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    units: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    set_total_cents: { type: DataTypes.BIGINT, allowNull: false, defaultValue: 0 },
    total_cents: { type: DataTypes.BIGINT, allowNull: false, defaultValue: 0 },
    lead_time_weeks: { type: DataTypes.INTEGER, allowNull: true },
    valid_until: { type: DataTypes.DATEONLY, allowNull: true },
    terms: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
    submitted_at: { type: DataTypes.DATE, allowNull: true },
    created_at: now,
    updated_at: now,
  });
  await qi.addIndex("bids", ["spec_id", "organisation_id"], { unique: true });
  await qi.addIndex("bids", ["organisation_id", "status"]);

  await qi.createTable("bid_versions", {
    id,
    bid_id: ref("bids"),
    version: { type: DataTypes.INTEGER, allowNull: false },
    /** "submitted" for each offer, "withdrawn" when it was taken back. */
    event: { type: DataTypes.ENUM("submitted", "withdrawn"), allowNull: false },
    spec_revision: { type: DataTypes.INTEGER, allowNull: false },
    /** The offer as it stood: lines, totals, lead time, validity, terms, notes. */
    offer: { type: DataTypes.JSONB, allowNull: false },
    created_by_id: ref("users", "RESTRICT"),
    created_at: now,
  });
  await qi.addIndex("bid_versions", ["bid_id", "created_at"]);

  await qi.createTable("jobs", {
    id,
    spec_id: { ...ref("specs", "RESTRICT"), unique: true },
    bid_id: { ...ref("bids", "RESTRICT"), unique: true },
    buyer_organisation_id: ref("organisations", "RESTRICT"),
    shop_organisation_id: ref("organisations", "RESTRICT"),
    awarded_by_id: ref("users", "RESTRICT"),
    awarded_at: now,
    currency: { type: DataTypes.STRING(3), allowNull: false },
    total_cents: { type: DataTypes.BIGINT, allowNull: false },
    retainer_percent: { type: DataTypes.DECIMAL(5, 2), allowNull: false },
    retainer_cents: { type: DataTypes.BIGINT, allowNull: false },
    retainer_paid_at: { type: DataTypes.DATE, allowNull: true },
    /** The latest milestone reached, or null before the first. */
    stage: { type: DataTypes.STRING(30), allowNull: true },
    created_at: now,
    updated_at: now,
  });
  await qi.addIndex("jobs", ["buyer_organisation_id", "awarded_at"]);
  await qi.addIndex("jobs", ["shop_organisation_id", "awarded_at"]);

  await qi.createTable("job_milestones", {
    id,
    job_id: ref("jobs"),
    key: { type: DataTypes.STRING(30), allowNull: false },
    position: { type: DataTypes.INTEGER, allowNull: false },
    target_date: { type: DataTypes.DATEONLY, allowNull: true },
    reached_at: { type: DataTypes.DATE, allowNull: true },
    reached_by_id: ref("users", "RESTRICT", true),
    created_at: now,
    updated_at: now,
  });
  await qi.addIndex("job_milestones", ["job_id", "key"], { unique: true });
  await qi.sequelize.query("CREATE INDEX job_milestones_open_target ON job_milestones (target_date) WHERE reached_at IS NULL");

  // The job's history: every change with who and when. Account managers' notes are internal
  // to the operator (visibility "operator"); everything else is seen by buyer and shop too.
  await qi.createTable("job_events", {
    id,
    job_id: ref("jobs"),
    user_id: ref("users", "RESTRICT"),
    kind: { type: DataTypes.STRING(30), allowNull: false },
    milestone: { type: DataTypes.STRING(30), allowNull: true },
    detail: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    body: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
    visibility: { type: DataTypes.ENUM("all", "operator"), allowNull: false, defaultValue: "all" },
    created_at: now,
  });
  await qi.addIndex("job_events", ["job_id", "created_at"]);
};

export const down: Migration = async ({ context: qi }) => {
  for (const table of ["job_events", "job_milestones", "jobs", "bid_versions", "bids", "spec_questions"]) await qi.dropTable(table);
  for (const type of ["enum_bids_status", "enum_bid_versions_event", "enum_job_events_visibility"]) {
    await qi.sequelize.query(`DROP TYPE IF EXISTS "${type}"`);
  }
  for (const index of ["specs_open_deadline", "specs_open_published", "specs_open_pressure", "specs_open_flow", "specs_title_trgm", "specs_region_trgm"]) {
    await qi.sequelize.query(`DROP INDEX IF EXISTS ${index}`);
  }
  for (const column of ["currency", "units_wanted", "relief_setting_bar", "pump_flow_lpm"]) await qi.removeColumn("specs", column);
};
