import { DataTypes, Sequelize } from "sequelize";
import type { Migration } from "../migrator";

const now = { type: DataTypes.DATE, allowNull: false, defaultValue: Sequelize.fn("now") };
const id = { type: DataTypes.UUID, primaryKey: true, defaultValue: Sequelize.literal("gen_random_uuid()") };
const ref = (table: string, onDelete = "CASCADE") => ({
  type: DataTypes.UUID,
  allowNull: false,
  references: { model: table, key: "id" },
  onDelete,
});

export const up: Migration = async ({ context: qi }) => {
  // A spec: one machine's request for quotation. Its answers are kept as typed while it is a
  // draft; each publication freezes requirements and designs into a numbered revision.
  await qi.createTable("specs", {
    id,
    organisation_id: ref("organisations"),
    created_by_id: ref("users", "RESTRICT"),
    title: { type: DataTypes.STRING(120), allowNull: false, defaultValue: "" },
    status: { type: DataTypes.ENUM("draft", "open", "closed", "awarded", "withdrawn"), allowNull: false, defaultValue: "draft" },
    /** Answers per step, as the buyer typed them (strings in their units), for resuming. */
    answers: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    unit_system: { type: DataTypes.ENUM("metric", "us"), allowNull: false, defaultValue: "metric" },
    /** The furthest step the buyer has completed; the form resumes after it. */
    completed_steps: { type: DataTypes.ARRAY(DataTypes.STRING(20)), allowNull: false, defaultValue: [] },
    current_revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    bid_deadline: { type: DataTypes.DATE, allowNull: true },
    retainer_percent: { type: DataTypes.DECIMAL(5, 2), allowNull: true },
    delivery_region: { type: DataTypes.STRING(80), allowNull: true },
    published_at: { type: DataTypes.DATE, allowNull: true },
    created_at: now,
    updated_at: now,
  });
  await qi.addIndex("specs", ["organisation_id", "status", "updated_at"]);
  await qi.addIndex("specs", ["status", "bid_deadline"]);

  await qi.createTable("spec_revisions", {
    id,
    spec_id: ref("specs"),
    number: { type: DataTypes.INTEGER, allowNull: false },
    /** [{ name, requirements (SI), design }]: one item today, several axes later. */
    axes: { type: DataTypes.JSONB, allowNull: false },
    answers: { type: DataTypes.JSONB, allowNull: false },
    unit_system: { type: DataTypes.ENUM("metric", "us"), allowNull: false },
    engine_version: { type: DataTypes.STRING(20), allowNull: false },
    created_by_id: ref("users", "RESTRICT"),
    created_at: now,
  });
  await qi.addIndex("spec_revisions", ["spec_id", "number"], { unique: true });

  await qi.createTable("spec_attachments", {
    id,
    spec_id: ref("specs"),
    file_name: { type: DataTypes.STRING(200), allowNull: false },
    content_type: { type: DataTypes.STRING(100), allowNull: false },
    size_bytes: { type: DataTypes.INTEGER, allowNull: false },
    storage_key: { type: DataTypes.STRING(200), allowNull: false, unique: true },
    uploaded_by_id: ref("users", "RESTRICT"),
    created_at: now,
  });
  await qi.addIndex("spec_attachments", ["spec_id"]);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable("spec_attachments");
  await qi.dropTable("spec_revisions");
  await qi.dropTable("specs");
  for (const type of ["enum_specs_status", "enum_specs_unit_system", "enum_spec_revisions_unit_system"]) {
    await qi.sequelize.query(`DROP TYPE IF EXISTS "${type}"`);
  }
};
