/**
 * Demo scenario (fictional): a British retailer buying from three producers, one of which ships
 * in bulk, and an independent laboratory. Every name and address here is invented.
 */
import type { QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";
import bcrypt from "bcryptjs";

export const DEMO_PASSWORD = "Cellarpact-demo-2026";

const ORGS = [
  { id: 1, name: "Harbourline Grocers", kind: "retailer", country: "GB" },
  { id: 2, name: "Domaine des Trois Sentes", kind: "producer", country: "FR" },
  { id: 3, name: "Kestrel Flats Estate", kind: "producer", country: "AU" },
  { id: 4, name: "Cantina Valsorda", kind: "producer", country: "IT" },
  { id: 5, name: "Northgate Oenology Laboratory", kind: "laboratory", country: "GB" },
] as const;

export const DEMO_PEOPLE = [
  { id: 1, name: "Sam Okafor", email: "sam.okafor@cellarpact.test", platformAdmin: true, org: null, role: null },
  { id: 2, name: "Tessa Marlow", email: "tessa.marlow@harbourline.test", platformAdmin: false, org: 1, role: "buyer_technologist" },
  { id: 3, name: "Owen Pryce", email: "owen.pryce@harbourline.test", platformAdmin: false, org: 1, role: "buyer_finance" },
  { id: 4, name: "Rhiannon Vale", email: "rhiannon.vale@harbourline.test", platformAdmin: false, org: 1, role: "org_admin" },
  { id: 5, name: "Élise Carbonnel", email: "elise.carbonnel@troissentes.test", platformAdmin: false, org: 2, role: "producer_quality" },
  { id: 6, name: "Mathieu Rocheval", email: "mathieu.rocheval@troissentes.test", platformAdmin: false, org: 2, role: "org_admin" },
  { id: 7, name: "Priya Anand", email: "priya.anand@kestrelflats.test", platformAdmin: false, org: 3, role: "producer_quality" },
  { id: 8, name: "Giulia Ferrante", email: "giulia.ferrante@valsorda.test", platformAdmin: false, org: 4, role: "producer_quality" },
  { id: 9, name: "Amos Kellett", email: "amos.kellett@northgate-lab.test", platformAdmin: false, org: 5, role: "lab_analyst" },
  { id: 10, name: "Nadia Brook", email: "nadia.brook@northgate-lab.test", platformAdmin: false, org: 5, role: "org_admin" },
] as const;

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  const now = new Date();
  const stamp = { created_at: now, updated_at: now };
  // Cost 10 keeps seeding quick; real accounts use the configured cost.
  const hash = await bcrypt.hash(DEMO_PASSWORD, 10);
  await qi.bulkInsert(
    "organisations",
    ORGS.map((o) => ({ ...o, ...stamp })),
  );
  await qi.bulkInsert(
    "users",
    DEMO_PEOPLE.map((p) => ({
      id: p.id,
      name: p.name,
      email: p.email,
      password_hash: hash,
      is_platform_admin: p.platformAdmin,
      session_version: 0,
      ...stamp,
    })),
  );
  await qi.bulkInsert(
    "memberships",
    DEMO_PEOPLE.filter((p) => p.org !== null).map((p) => ({ user_id: p.id, organisation_id: p.org, role: p.role, ...stamp })),
  );
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.bulkDelete("memberships", { user_id: DEMO_PEOPLE.map((p) => p.id) });
  await qi.bulkDelete("users", { id: DEMO_PEOPLE.map((p) => p.id) });
  await qi.bulkDelete("organisations", { id: ORGS.map((o) => o.id) });
}
