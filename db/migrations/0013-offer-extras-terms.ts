import { DataTypes, Sequelize } from "sequelize";
import type { Migration } from "../migrator";

// An offer quotes the whole job: work beyond the bill (assembly, wiring, … and the shop's own
// lines), structured delivery and payment terms, an alternative circuit, and the shop's own
// documents. The free-text terms go: what a shop wrote there is kept, moved into its notes, so
// no old offer loses a word (its history rows keep the offer as it was, terms included).
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn("bids", "extras", { type: DataTypes.JSONB, allowNull: false, defaultValue: [] });
  await qi.addColumn("bids", "own_lines", { type: DataTypes.JSONB, allowNull: false, defaultValue: [] });
  await qi.addColumn("bids", "offer_terms", { type: DataTypes.JSONB, allowNull: true });
  await qi.addColumn("bids", "alternative_circuit", { type: DataTypes.JSONB, allowNull: true });
  await qi.sequelize.query(`
    UPDATE bids SET notes = CASE WHEN notes = '' THEN 'Terms as written: ' || terms ELSE notes || E'\\n\\nTerms as written: ' || terms END
    WHERE terms <> ''`);
  await qi.removeColumn("bids", "terms");

  await qi.createTable("bid_documents", {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: Sequelize.literal("gen_random_uuid()") },
    bid_id: { type: DataTypes.UUID, allowNull: false, references: { model: "bids", key: "id" }, onDelete: "CASCADE" },
    file_name: { type: DataTypes.STRING(200), allowNull: false },
    content_type: { type: DataTypes.STRING(100), allowNull: false },
    size_bytes: { type: DataTypes.INTEGER, allowNull: false },
    storage_key: { type: DataTypes.STRING(200), allowNull: false, unique: true },
    uploaded_by_id: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" }, onDelete: "RESTRICT" },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: Sequelize.fn("now") },
  });
  await qi.addIndex("bid_documents", ["bid_id"]);
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable("bid_documents");
  await qi.addColumn("bids", "terms", { type: DataTypes.TEXT, allowNull: false, defaultValue: "" });
  for (const column of ["alternative_circuit", "offer_terms", "own_lines", "extras"]) await qi.removeColumn("bids", column);
};
