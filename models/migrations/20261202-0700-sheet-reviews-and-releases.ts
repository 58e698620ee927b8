import { DataTypes, type QueryInterface } from "sequelize";

// Frozen: the lists and columns of its day (lib/domain/reviews.ts then), not imported.
const candidateStates = ["in-review", "changes-requested", "approved", "released", "stale"];
const signatureMeanings = ["approved-for-release"];
const commentAnchorKinds = ["sheet", "row", "chart", "prose"];

const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false };
const createdAt = { created_at: { type: DataTypes.DATE(3), allowNull: false } };
const timestamps = { ...createdAt, updated_at: { type: DataTypes.DATE(3), allowNull: false } };
const ref = (table: string, allowNull = false) => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull,
  references: { model: table, key: "id" },
  onDelete: "RESTRICT",
  onUpdate: "RESTRICT",
});

/** Tables whose rows, once written, are never changed or removed: the triggers refuse it. */
const appendOnly = ["sheet_signatures", "sheet_revisions", "sheet_revision_withdrawals"];

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn("organizations", "required_signatures", { type: DataTypes.TINYINT.UNSIGNED, allowNull: false, defaultValue: 1 });

  await qi.createTable("sheet_candidates", {
    id,
    organization_id: ref("organizations"),
    device_id: ref("devices"),
    // Equal to device_id while the candidate is open, NULL once closed: one open candidate per device.
    open_device_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, unique: true },
    state: { type: DataTypes.ENUM(...candidateStates), allowNull: false },
    model_json: { type: DataTypes.TEXT("long"), allowNull: false },
    model_digest: { type: DataTypes.CHAR(64), allowNull: false },
    model_date: { type: DataTypes.DATEONLY, allowNull: false },
    acknowledgements: { type: DataTypes.JSON, allowNull: false },
    note: { type: DataTypes.TEXT, allowNull: false },
    required_signatures: { type: DataTypes.TINYINT.UNSIGNED, allowNull: false },
    compared_revision_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    submitted_by_id: ref("users"),
    submitted_at: { type: DataTypes.DATE(3), allowNull: false },
    decided_by_id: ref("users", true),
    decided_at: { type: DataTypes.DATE(3), allowNull: true },
    change_request: { type: DataTypes.TEXT, allowNull: true },
    stale_reason: { type: DataTypes.TEXT, allowNull: true },
    closed_at: { type: DataTypes.DATE(3), allowNull: true },
    ...timestamps,
  });
  await qi.addIndex("sheet_candidates", ["organization_id", "state"]);
  await qi.addIndex("sheet_candidates", ["device_id", "id"]);

  await qi.createTable("sheet_signatures", {
    id,
    organization_id: ref("organizations"),
    candidate_id: ref("sheet_candidates"),
    signer_id: ref("users"),
    printed_name: { type: DataTypes.STRING(120), allowNull: false },
    role_word: { type: DataTypes.STRING(40), allowNull: false },
    organization_name: { type: DataTypes.STRING(160), allowNull: false },
    meaning: { type: DataTypes.ENUM(...signatureMeanings), allowNull: false },
    candidate_digest: { type: DataTypes.CHAR(64), allowNull: false },
    signed_at: { type: DataTypes.DATE(3), allowNull: false },
    ...createdAt,
  });
  await qi.addIndex("sheet_signatures", ["candidate_id", "signer_id"], { unique: true });

  await qi.createTable("sheet_comments", {
    id,
    organization_id: ref("organizations"),
    device_id: ref("devices"),
    candidate_id: ref("sheet_candidates"),
    parent_id: ref("sheet_comments", true),
    author_id: ref("users"),
    anchor_kind: { type: DataTypes.ENUM(...commentAnchorKinds), allowNull: false },
    anchor_id: { type: DataTypes.STRING(200), allowNull: true },
    anchor_label: { type: DataTypes.STRING(300), allowNull: false },
    body: { type: DataTypes.TEXT, allowNull: false },
    resolved_by_id: ref("users", true),
    resolved_at: { type: DataTypes.DATE(3), allowNull: true },
    ...timestamps,
  });
  await qi.addIndex("sheet_comments", ["device_id", "id"]);

  await qi.createTable("sheet_revisions", {
    id,
    organization_id: ref("organizations"),
    device_id: ref("devices"),
    candidate_id: { ...ref("sheet_candidates"), unique: true },
    sequence: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    letter: { type: DataTypes.STRING(4), allowNull: false },
    // The revision this one supersedes: unique, so two releases can never both succeed the same one.
    previous_revision_id: { ...ref("sheet_revisions", true), unique: true },
    model_json: { type: DataTypes.TEXT("long"), allowNull: false },
    model_digest: { type: DataTypes.CHAR(64), allowNull: false },
    pdf: { type: DataTypes.BLOB("long"), allowNull: false },
    pdf_sha256: { type: DataTypes.CHAR(64), allowNull: false },
    pdf_bytes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    reference: { type: DataTypes.STRING(16), allowNull: false, unique: true },
    release_notes: { type: DataTypes.JSON, allowNull: false },
    engineer_note: { type: DataTypes.TEXT, allowNull: false },
    released_by_id: ref("users"),
    released_at: { type: DataTypes.DATE(3), allowNull: false },
    ...createdAt,
  });
  await qi.addIndex("sheet_revisions", ["device_id", "sequence"], { unique: true });
  await qi.addIndex("sheet_revisions", ["device_id", "letter"], { unique: true });

  await qi.createTable("sheet_revision_withdrawals", {
    id,
    organization_id: ref("organizations"),
    revision_id: { ...ref("sheet_revisions"), unique: true },
    reason: { type: DataTypes.TEXT, allowNull: false },
    withdrawn_by_id: ref("users"),
    withdrawn_at: { type: DataTypes.DATE(3), allowNull: false },
    ...createdAt,
  });

  const sql = (text: string) => qi.sequelize.query(text);
  for (const table of appendOnly) {
    for (const op of ["UPDATE", "DELETE"]) {
      await sql(
        `CREATE TRIGGER ${table}_no_${op.toLowerCase()} BEFORE ${op} ON ${table} FOR EACH ROW ` +
          `SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = '${table} is append-only: a released record never changes'`,
      );
    }
  }
  // A candidate's frozen model never changes, and a candidate is never removed (its signatures point at it).
  await sql(
    `CREATE TRIGGER sheet_candidates_frozen BEFORE UPDATE ON sheet_candidates FOR EACH ROW ` +
      `IF NEW.model_json <> OLD.model_json OR NEW.model_digest <> OLD.model_digest OR NEW.device_id <> OLD.device_id ` +
      `OR NEW.organization_id <> OLD.organization_id OR NEW.submitted_by_id <> OLD.submitted_by_id THEN ` +
      `SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'sheet_candidates: the submitted model is frozen'; END IF`,
  );
  await sql(
    `CREATE TRIGGER sheet_candidates_no_delete BEFORE DELETE ON sheet_candidates FOR EACH ROW ` +
      `SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'sheet_candidates are kept: signatures and revisions point at them'`,
  );
  // A signature names the digest of the very candidate it is attached to (21 CFR Part 11 §11.70).
  await sql(
    `CREATE TRIGGER sheet_signatures_linked BEFORE INSERT ON sheet_signatures FOR EACH ROW ` +
      `IF NOT EXISTS (SELECT 1 FROM sheet_candidates c WHERE c.id = NEW.candidate_id AND c.model_digest = NEW.candidate_digest) THEN ` +
      `SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'sheet_signatures: the digest is not the candidate''s'; END IF`,
  );
}

export async function down({ context: qi }: { context: QueryInterface }) {
  const sql = (text: string) => qi.sequelize.query(text);
  for (const table of appendOnly) for (const op of ["update", "delete"]) await sql(`DROP TRIGGER IF EXISTS ${table}_no_${op}`);
  for (const name of ["sheet_candidates_frozen", "sheet_candidates_no_delete", "sheet_signatures_linked"]) await sql(`DROP TRIGGER IF EXISTS ${name}`);
  for (const table of ["sheet_revision_withdrawals", "sheet_revisions", "sheet_comments", "sheet_signatures", "sheet_candidates"]) {
    await qi.dropTable(table);
  }
  await qi.removeColumn("organizations", "required_signatures");
}
