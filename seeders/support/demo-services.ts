/** Seeders act through the services, as people do: the database and settings the services need, and a demo person by e-mail. */
import type { QueryInterface } from "sequelize";
import { useDatabase } from "../../server/db/database.ts";
import { loadConfig } from "../../server/config.ts";
import { settingsFrom, useServiceSettings } from "../../server/settings.ts";
import { User } from "../../server/models/user.ts";
import { toSessionUser } from "../../server/services/session-service.ts";
import type { Role } from "../../shared/auth/roles.ts";

export function useDemoServices(qi: QueryInterface): void {
  useDatabase(qi.sequelize);
  useServiceSettings(settingsFrom(loadConfig()));
}

/** A demo member and the organisation where they hold `role`. */
export async function demoMember(email: string, role: Role) {
  const user = await toSessionUser((await User.findOne({ where: { email } }))!);
  return { user, orgId: user.memberships.find((m) => m.role === role)!.organisationId };
}
