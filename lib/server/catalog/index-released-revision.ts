import "server-only";
import type { Transaction } from "sequelize";
import { releasedSpecValues } from "@/lib/catalog/released-spec-values";
import type { KeyConditions } from "@/lib/domain/devices";
import type { SheetModel } from "@/lib/sheet";
import { db } from "@/models";

export type RevisionToIndex = {
  revisionId: number;
  organizationId: number;
  deviceId: number;
  letter: string;
  releasedAt: Date;
  model: SheetModel;
  /** The device's key conditions the released model was built from (the release checks the candidate is fresh). */
  keyConditions: KeyConditions;
};

/**
 * Writes the catalog's search rows of one released revision (released_sheets and
 * released_spec_values) inside the release transaction, so a revision is searchable exactly when
 * it exists. Idempotent: a revision already indexed is left as it is.
 */
export async function indexReleasedRevision(revision: RevisionToIndex, transaction: Transaction): Promise<void> {
  const { sequelize } = db();
  const { model, keyConditions: k } = revision;
  const deviceClass = model.template.deviceClass;
  await sequelize.query(
    `INSERT IGNORE INTO released_sheets (revision_id, organization_id, device_id, device_class, part_number, title, letter,
       input_min_hz, input_max_hz, output_min_hz, output_max_hz, drive_dbm, released_at)
     VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
    {
      replacements: [
        revision.revisionId, revision.organizationId, revision.deviceId, deviceClass, model.header.partNumber, model.header.title.slice(0, 200), revision.letter,
        k.inputFrequencyHz?.min ?? null, k.inputFrequencyHz?.max ?? null, k.outputFrequencyHz?.min ?? null, k.outputFrequencyHz?.max ?? null,
        k.driveLevelDbm ?? null, revision.releasedAt,
      ],
      transaction,
    },
  );
  const values = releasedSpecValues(model);
  if (!values.length) return;
  const tuple = "(?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)";
  await sequelize.query(
    `INSERT IGNORE INTO released_spec_values (revision_id, organization_id, device_id, device_class, row_id, parameter, conditions_key,
       min_value, typ_value, max_value, unit)
     VALUES ${values.map(() => tuple).join(", ")}`,
    {
      replacements: values.flatMap((v) => [
        revision.revisionId, revision.organizationId, revision.deviceId, deviceClass, v.rowId, v.parameter, v.conditionsKey, v.min, v.typ, v.max, v.unit,
      ]),
      transaction,
    },
  );
}
