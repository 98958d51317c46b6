import { DataTypes, type QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

const user = (allowNull = false) => ({ type: DataTypes.INTEGER, allowNull, references: { model: "users", key: "id" } });

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.addColumn("deviations", "respond_by", { type: DataTypes.DATE(3), allowNull: true });
  await qi.addColumn("deviations", "decision", { type: DataTypes.JSON, allowNull: true });
  await qi.addColumn("deviations", "decided_at", { type: DataTypes.DATE(3), allowNull: true });
  await qi.addColumn("deviations", "decided_by", user(true));
  await qi.addColumn("deviations", "deadline_warned_at", { type: DataTypes.DATE(3), allowNull: true });

  await qi.createTable("deviation_messages", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    deviation_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "deviations", key: "id" }, onDelete: "CASCADE" },
    parent_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "deviation_messages", key: "id" } },
    author_user_id: user(),
    organisation_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "organisations", key: "id" } },
    kind: { type: DataTypes.ENUM("comment", "proposal", "acceptance", "decision"), allowNull: false },
    body: { type: DataTypes.TEXT, allowNull: false },
    proposal: { type: DataTypes.JSON, allowNull: true },
    quote: { type: DataTypes.JSON, allowNull: true },
    mentions: { type: DataTypes.JSON, allowNull: false },
    edited_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex("deviation_messages", ["deviation_id"], { name: "deviation_messages_deviation" });

  // Earlier wordings of edited messages; a message's history is never lost.
  await qi.createTable("deviation_message_edits", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    message_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "deviation_messages", key: "id" }, onDelete: "CASCADE" },
    previous_body: { type: DataTypes.TEXT, allowNull: false },
    edited_at: { type: DataTypes.DATE(3), allowNull: false },
  });

  await qi.createTable("deviation_attachments", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    message_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "deviation_messages", key: "id" }, onDelete: "CASCADE" },
    original_name: { type: DataTypes.STRING(200), allowNull: false },
    stored_name: { type: DataTypes.STRING(80), allowNull: false },
    mime: { type: DataTypes.STRING(60), allowNull: false },
    size_bytes: { type: DataTypes.INTEGER, allowNull: false },
    sha256: { type: DataTypes.CHAR(64), allowNull: false },
    uploaded_by: user(),
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });

  await qi.createTable("notifications", {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
    kind: { type: DataTypes.STRING(30), allowNull: false },
    title: { type: DataTypes.STRING(250), allowNull: false },
    body: { type: DataTypes.TEXT, allowNull: false },
    link: { type: DataTypes.STRING(250), allowNull: false },
    read_at: { type: DataTypes.DATE(3), allowNull: true },
    digested_at: { type: DataTypes.DATE(3), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex("notifications", ["user_id", "read_at"], { name: "notifications_user" });

  await qi.createTable("notification_preferences", {
    user_id: { type: DataTypes.INTEGER, primaryKey: true, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
    email_mode: { type: DataTypes.ENUM("immediate", "daily_digest", "off"), allowNull: false },
    kinds: { type: DataTypes.JSON, allowNull: false },
    last_digest_at: { type: DataTypes.DATE(3), allowNull: true },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.dropTable("notification_preferences");
  await qi.dropTable("notifications");
  await qi.dropTable("deviation_attachments");
  await qi.dropTable("deviation_message_edits");
  await qi.dropTable("deviation_messages");
  // Raw SQL: removeColumn trips over the connector options this project uses (see server/db/connection.ts).
  await qi.sequelize.query("ALTER TABLE deviations DROP FOREIGN KEY IF EXISTS deviations_decided_by_foreign_idx");
  for (const c of ["deadline_warned_at", "decided_by", "decided_at", "decision", "respond_by"])
    await qi.sequelize.query(`ALTER TABLE deviations DROP COLUMN ${c}`);
}
