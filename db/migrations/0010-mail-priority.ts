import { DataTypes } from "sequelize";
import type { Migration } from "../migrator";

// Mail has a priority, so a password reset or an invitation is sent before a queue of
// announcements: the sender claims due rows by priority, then by how long they have been due.
// 0 = account mail (sign-in links, account notices), 1 = activity, 2 = announcements to many.
export const up: Migration = async ({ context: qi }) => {
  await qi.addColumn("outbox_mails", "priority", { type: DataTypes.SMALLINT, allowNull: false, defaultValue: 1 });
  await qi.sequelize.query("ALTER TABLE outbox_mails ADD CONSTRAINT outbox_mails_priority_range CHECK (priority BETWEEN 0 AND 2)");
  // Account mail queued before this migration goes first too.
  await qi.sequelize.query(
    "UPDATE outbox_mails SET priority = 0 WHERE status = 'pending' AND (subject = 'Reset your Tenderflow password' OR subject LIKE '% invited you to % on Tenderflow')",
  );
  // The sender's query reads this index in its order and stops at the first due row it can lock.
  await qi.sequelize.query("DROP INDEX IF EXISTS outbox_mails_due");
  await qi.sequelize.query("CREATE INDEX outbox_mails_due ON outbox_mails (priority, next_attempt_at) WHERE status = 'pending'");
  // The admin's mail page lists failed mail, newest first.
  await qi.sequelize.query("CREATE INDEX outbox_mails_failed ON outbox_mails (updated_at DESC) WHERE status = 'failed'");
};

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query("DROP INDEX IF EXISTS outbox_mails_failed");
  await qi.sequelize.query("DROP INDEX IF EXISTS outbox_mails_due");
  await qi.removeColumn("outbox_mails", "priority");
  await qi.sequelize.query("CREATE INDEX outbox_mails_due ON outbox_mails (next_attempt_at) WHERE status = 'pending'");
};
