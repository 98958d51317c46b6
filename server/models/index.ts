/** Initialises every model on one Sequelize instance and declares all associations in one place. */
import type { Sequelize } from "sequelize";
import { Organisation } from "./organisation.ts";
import { User } from "./user.ts";
import { Membership } from "./membership.ts";
import { Invitation } from "./invitation.ts";
import { PasswordReset } from "./password-reset.ts";
import { AuditEvent, AuditHead } from "./audit-event.ts";
import { OutboxMessage } from "./outbox-message.ts";

export function initModels(sequelize: Sequelize): void {
  for (const m of [Organisation, User, Membership, Invitation, PasswordReset, AuditEvent, AuditHead, OutboxMessage]) {
    m.initModel(sequelize);
  }
  Membership.belongsTo(User, { foreignKey: "userId", as: "user" });
  Membership.belongsTo(Organisation, { foreignKey: "organisationId", as: "organisation" });
  User.hasMany(Membership, { foreignKey: "userId", as: "memberships" });
  Organisation.hasMany(Membership, { foreignKey: "organisationId", as: "memberships" });
  Invitation.belongsTo(Organisation, { foreignKey: "organisationId", as: "organisation" });
}
