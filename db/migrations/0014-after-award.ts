import { DataTypes } from "sequelize";
import type { Migration } from "../migrator";

// After the award: the order confirmation kept with the job (never changed once made), the
// buyer's acceptance of the handover, files exchanged on the job (test certificates, the approved
// drawing, photos of a problem), and the balance, paid by card like the retainer or recorded as
// a bank transfer by the account's manager.
export const up: Migration = async ({ context: qi }) => {
  // Order numbers are ours, in order of award: TF-<year>-<six digits>.
  await qi.sequelize.query("CREATE SEQUENCE order_number_seq START 1");
  await qi.createTable("order_confirmations", {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: qi.sequelize.literal("gen_random_uuid()") },
    job_id: { type: DataTypes.UUID, allowNull: false, unique: true, references: { model: "jobs", key: "id" }, onDelete: "CASCADE" },
    number: { type: DataTypes.STRING(20), allowNull: false, unique: true },
    /** Everything the document says, as it was at the award. */
    document: { type: DataTypes.JSONB, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: qi.sequelize.fn("now") },
  });
  // The document is what both parties agreed to: no code path may rewrite it.
  await qi.sequelize.query(`
    CREATE FUNCTION order_confirmations_immutable() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN RAISE EXCEPTION 'order confirmations are not changed once made'; END $$`);
  await qi.sequelize.query(
    "CREATE TRIGGER order_confirmations_no_update BEFORE UPDATE ON order_confirmations FOR EACH ROW EXECUTE FUNCTION order_confirmations_immutable()",
  );

  await qi.addColumn("jobs", "accepted_at", { type: DataTypes.DATE, allowNull: true });
  await qi.addColumn("jobs", "accepted_by_id", { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" }, onDelete: "SET NULL" });
  await qi.addColumn("jobs", "balance_paid_at", { type: DataTypes.DATE, allowNull: true });
  await qi.addColumn("jobs", "balance_method", { type: DataTypes.STRING(20), allowNull: true });
  await qi.addColumn("jobs", "balance_reference", { type: DataTypes.STRING(200), allowNull: true });
  await qi.sequelize.query("ALTER TABLE jobs ADD CONSTRAINT jobs_balance_method CHECK (balance_method IN ('card', 'bank_transfer'))");
  await qi.sequelize.query("ALTER TABLE jobs ADD CONSTRAINT jobs_balance_paid CHECK ((balance_paid_at IS NULL) = (balance_method IS NULL))");

  await qi.createTable("job_files", {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: qi.sequelize.literal("gen_random_uuid()") },
    job_id: { type: DataTypes.UUID, allowNull: false, references: { model: "jobs", key: "id" }, onDelete: "CASCADE" },
    kind: { type: DataTypes.STRING(30), allowNull: false },
    file_name: { type: DataTypes.STRING(200), allowNull: false },
    content_type: { type: DataTypes.STRING(100), allowNull: false },
    size_bytes: { type: DataTypes.INTEGER, allowNull: false },
    storage_key: { type: DataTypes.STRING(200), allowNull: false },
    uploaded_by_id: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" } },
    /** The problem report a photo belongs to. */
    event_id: { type: DataTypes.UUID, allowNull: true, references: { model: "job_events", key: "id" }, onDelete: "SET NULL" },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: qi.sequelize.fn("now") },
  });
  await qi.sequelize.query("ALTER TABLE job_files ADD CONSTRAINT job_files_kind CHECK (kind IN ('test_certificate', 'approved_drawing', 'problem_photo'))");
  await qi.addIndex("job_files", ["job_id", "created_at"]);

  // A job now has a retainer and a balance, each with at most one open checkout.
  await qi.addColumn("payments", "purpose", { type: DataTypes.STRING(10), allowNull: false, defaultValue: "retainer" });
  await qi.sequelize.query("ALTER TABLE payments ADD CONSTRAINT payments_purpose CHECK (purpose IN ('retainer', 'balance'))");
  await qi.sequelize.query("DROP INDEX payments_one_open_per_job");
  await qi.sequelize.query("CREATE UNIQUE INDEX payments_one_open_per_job ON payments (job_id, purpose) WHERE status IN ('pending', 'failed')");
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query("DROP INDEX payments_one_open_per_job");
  await qi.sequelize.query("DELETE FROM payments WHERE purpose = 'balance'");
  await qi.sequelize.query("CREATE UNIQUE INDEX payments_one_open_per_job ON payments (job_id) WHERE status IN ('pending', 'failed')");
  await qi.sequelize.query("ALTER TABLE payments DROP CONSTRAINT payments_purpose");
  await qi.removeColumn("payments", "purpose");
  await qi.dropTable("job_files");
  await qi.sequelize.query("ALTER TABLE jobs DROP CONSTRAINT jobs_balance_paid");
  await qi.sequelize.query("ALTER TABLE jobs DROP CONSTRAINT jobs_balance_method");
  for (const column of ["balance_reference", "balance_method", "balance_paid_at", "accepted_by_id", "accepted_at"]) await qi.removeColumn("jobs", column);
  await qi.dropTable("order_confirmations");
  await qi.sequelize.query("DROP FUNCTION IF EXISTS order_confirmations_immutable()");
  await qi.sequelize.query("DROP SEQUENCE IF EXISTS order_number_seq");
};
