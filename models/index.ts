import type { Sequelize } from "sequelize";
import { onShutdown } from "../lib/shutdown";
import { createSequelize } from "./connection";
import { AccountMailRequest } from "./account-mail-request";
import { AuditEvent } from "./audit-event";
import { BenchToken } from "./bench-token";
import { ColumnMapping } from "./column-mapping";
import { ConformityAlert } from "./conformity-alert";
import { Instrument } from "./instrument";
import { MeasurementSet, MeasurementSetInstrument } from "./measurement-set";
import { SheetContent } from "./sheet-content";
import { SheetCandidate } from "./sheet-candidate";
import { SheetComment } from "./sheet-comment";
import { SheetRevision } from "./sheet-revision";
import { SheetRevisionWithdrawal } from "./sheet-revision-withdrawal";
import { SheetSignature } from "./sheet-signature";
import { SpecLimit } from "./spec-limit";
import { StoredFile } from "./stored-file";
import { Device } from "./device";
import { Invitation } from "./invitation";
import { Organization } from "./organization";
import { OutboxMessage } from "./outbox-message";
import { PasswordReset } from "./password-reset";
import { RevokedSession } from "./revoked-session";
import { SignInAttempt } from "./sign-in-attempt";
import { SignUpRequest } from "./sign-up-request";
import { Subscription } from "./subscription";
import { User } from "./user";

export type {
  AccountMailRequest,
  AuditEvent,
  BenchToken,
  ColumnMapping,
  ConformityAlert,
  Device,
  Instrument,
  Invitation,
  MeasurementSet,
  MeasurementSetInstrument,
  Organization,
  OutboxMessage,
  PasswordReset,
  RevokedSession,
  SheetCandidate,
  SheetComment,
  SheetContent,
  SheetRevision,
  SheetRevisionWithdrawal,
  SheetSignature,
  SignInAttempt,
  SignUpRequest,
  SpecLimit,
  StoredFile,
  Subscription,
  User,
};
export * from "./connection";
export { sharedSecret, withDatabaseLock } from "./instance-secrets";

/** Every model, by name: what db() hands out, and what initModels sets up (one list, so none is left out). */
const models = {
  AccountMailRequest,
  AuditEvent,
  BenchToken,
  ColumnMapping,
  ConformityAlert,
  Device,
  Instrument,
  Invitation,
  MeasurementSet,
  MeasurementSetInstrument,
  Organization,
  OutboxMessage,
  PasswordReset,
  RevokedSession,
  SheetCandidate,
  SheetComment,
  SheetContent,
  SheetRevision,
  SheetRevisionWithdrawal,
  SheetSignature,
  SignInAttempt,
  SignUpRequest,
  SpecLimit,
  StoredFile,
  Subscription,
  User,
};

function initModels(sequelize: Sequelize): Sequelize {
  for (const model of Object.values(models)) model.initModel(sequelize);
  Organization.hasMany(User, { foreignKey: "organizationId" });
  User.belongsTo(Organization, { foreignKey: "organizationId" });
  Organization.hasMany(Device, { foreignKey: "organizationId" });
  Device.belongsTo(Organization, { foreignKey: "organizationId" });
  Invitation.belongsTo(Organization, { foreignKey: "organizationId" });
  Invitation.belongsTo(User, { as: "invitedBy", foreignKey: "invitedById" });
  PasswordReset.belongsTo(User, { foreignKey: "userId" });
  Device.hasMany(MeasurementSet, { foreignKey: "deviceId" });
  MeasurementSet.belongsTo(Device, { foreignKey: "deviceId" });
  MeasurementSet.belongsTo(StoredFile, { foreignKey: "storedFileId" });
  MeasurementSet.belongsTo(User, { as: "uploadedBy", foreignKey: "uploadedById" });
  MeasurementSet.belongsTo(User, { as: "reviewedBy", foreignKey: "reviewedById" });
  MeasurementSet.belongsTo(BenchToken, { as: "benchToken", foreignKey: "benchTokenId" });
  MeasurementSet.belongsToMany(Instrument, { through: MeasurementSetInstrument, foreignKey: "measurementSetId", otherKey: "instrumentId" });
  Instrument.belongsToMany(MeasurementSet, { through: MeasurementSetInstrument, foreignKey: "instrumentId", otherKey: "measurementSetId" });
  SheetCandidate.belongsTo(Device, { foreignKey: "deviceId" });
  SheetCandidate.belongsTo(User, { as: "submittedBy", foreignKey: "submittedById" });
  SheetCandidate.hasMany(SheetSignature, { foreignKey: "candidateId" });
  SheetComment.belongsTo(User, { as: "author", foreignKey: "authorId" });
  SheetRevision.belongsTo(Device, { foreignKey: "deviceId" });
  SheetRevision.belongsTo(SheetCandidate, { foreignKey: "candidateId" });
  SheetRevision.hasOne(SheetRevisionWithdrawal, { foreignKey: "revisionId" });
  Subscription.belongsTo(Device, { foreignKey: "deviceId" });
  Subscription.belongsTo(Organization, { foreignKey: "organizationId" });
  ConformityAlert.belongsTo(MeasurementSet, { foreignKey: "measurementSetId" });
  ConformityAlert.belongsTo(SheetRevision, { foreignKey: "revisionId" });
  ConformityAlert.belongsTo(User, { as: "closedBy", foreignKey: "closedById" });
  return sequelize;
}

/** The connection and every model, initialised on it. */
export type Database = typeof models & { sequelize: Sequelize };

// Next bundles this module separately into route handlers and pages, each with its own copy of
// the model classes; every copy needs its own initialised Sequelize, so the instance lives here,
// in the module, not on globalThis.
let instance: Database | undefined;
let forgetShutdownHook: (() => void) | undefined;

/**
 * The one way to a model: `const { Device, sequelize } = db()`. The models come only from here
 * (the module exports them as types alone), so no query can run on a model before its
 * connection is set up.
 */
export function db(): Database {
  if (!instance) {
    instance = { ...models, sequelize: initModels(createSequelize()) };
    // The app server closes every copy's pool on SIGTERM, after its requests are finished (lib/shutdown.ts).
    forgetShutdownHook = onShutdown("database pool", closeDb);
  }
  return instance;
}

export async function closeDb(): Promise<void> {
  if (instance) {
    const closing = instance.sequelize;
    instance = undefined;
    forgetShutdownHook?.();
    forgetShutdownHook = undefined;
    await closing.close();
  }
}
