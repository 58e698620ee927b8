import type { Sequelize } from "sequelize";
import { createSequelize } from "./connection";
import { AuditEvent } from "./audit-event";
import { Device } from "./device";
import { Invitation } from "./invitation";
import { Organization } from "./organization";
import { PasswordReset } from "./password-reset";
import { SignInAttempt } from "./sign-in-attempt";
import { User } from "./user";

export { AuditEvent, Device, Invitation, Organization, PasswordReset, SignInAttempt, User };
export * from "./connection";

function initModels(sequelize: Sequelize): Sequelize {
  for (const model of [Organization, User, Invitation, PasswordReset, SignInAttempt, AuditEvent, Device]) {
    model.initModel(sequelize);
  }
  Organization.hasMany(User, { foreignKey: "organizationId" });
  User.belongsTo(Organization, { foreignKey: "organizationId" });
  Organization.hasMany(Device, { foreignKey: "organizationId" });
  Device.belongsTo(Organization, { foreignKey: "organizationId" });
  Invitation.belongsTo(Organization, { foreignKey: "organizationId" });
  Invitation.belongsTo(User, { as: "invitedBy", foreignKey: "invitedById" });
  PasswordReset.belongsTo(User, { foreignKey: "userId" });
  return sequelize;
}

// One connection pool per process, kept across hot reloads in development.
const holder = globalThis as unknown as { __octavoSequelize?: Sequelize };

export function getSequelize(): Sequelize {
  holder.__octavoSequelize ??= initModels(createSequelize());
  return holder.__octavoSequelize;
}

export async function closeSequelize(): Promise<void> {
  if (holder.__octavoSequelize) {
    await holder.__octavoSequelize.close();
    holder.__octavoSequelize = undefined;
  }
}
