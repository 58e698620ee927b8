import bcrypt from "bcryptjs";
import type { QueryInterface } from "sequelize";
import { db } from "..";
import { demoOrganizations, demoPassword } from "./demo-scenario";

export async function up({ context: qi }: { context: QueryInterface }) {
  const { Device, Organization, User } = db();
  // The cost of every stored password (lib/server/accounts/hash-password.ts) and of the sign-in decoy.
  const passwordHash = await bcrypt.hash(demoPassword, 11);
  await qi.sequelize.transaction(async (transaction) => {
    for (const spec of demoOrganizations) {
      const [organization] = await Organization.findOrCreate({
        where: { slug: spec.slug },
        defaults: { slug: spec.slug, name: spec.name, kind: spec.kind },
        transaction,
      });
      let engineerId: number | null = null;
      for (const u of spec.users) {
        const [user] = await User.findOrCreate({
          where: { email: u.email },
          defaults: { ...u, organizationId: organization.id, passwordHash },
          transaction,
        });
        if (u.role === "engineer") engineerId = user.id;
      }
      for (const d of spec.devices) {
        await Device.findOrCreate({
          where: { organizationId: organization.id, partNumber: d.partNumber },
          defaults: { ...d, organizationId: organization.id, createdById: engineerId },
          transaction,
        });
      }
    }
  });
}

export async function down() {
  // Demo data is removed by resetting the database, never row by row.
}
