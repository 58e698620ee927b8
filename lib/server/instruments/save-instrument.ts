import "server-only";
import { UniqueConstraintError } from "sequelize";
import { AppError } from "@/lib/errors";
import type { InstrumentBody } from "@/lib/schemas/measurements";
import { db } from "@/models";
import type { Instrument } from "@/models";
import { recordAuditEvent } from "../audit/record-audit-event";
import { authorize } from "../auth/authorize";
import type { SessionUser } from "../auth/session-user";
import { toInstrumentSummary, type InstrumentSummary } from "./instrument-summary";
import { lockOwnRow } from "../auth/own-row";
import { refreshOpenCandidates } from "../reviews/freshness";

/** Creates an instrument, or updates one of the admin's organization when `instrumentId` is given. */
export async function saveInstrument(opts: { actor: SessionUser; input: InstrumentBody; instrumentId?: number }): Promise<InstrumentSummary> {
  const { Instrument, sequelize } = db();
  const { actor, input, instrumentId } = opts;
  authorize(actor, "instrument-admin");
  try {
    const saved = await sequelize.transaction(async (transaction) => {
      let row: Instrument | null = null;
      let before: unknown = null;
      if (instrumentId) {
        row = await lockOwnRow(Instrument, instrumentId, actor, transaction, "instrument");
        before = toInstrumentSummary(row);
        await row.update(input, { transaction });
      } else {
        row = await Instrument.create({ ...input, organizationId: actor.organizationId }, { transaction });
      }
      const after = toInstrumentSummary(row);
      await recordAuditEvent(
        { organizationId: actor.organizationId, actorUserId: actor.id, action: instrumentId ? "instrument.update" : "instrument.create", subjectType: "instrument", subjectId: row.id, before, after },
        transaction,
      );
      return after;
    });
    // An instrument's calibration is printed in the traceability of every sheet citing it.
    if (instrumentId) await refreshOpenCandidates({ organizationId: actor.organizationId });
    return saved;
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw new AppError("conflict", `An instrument with serial ${input.serial} is already listed.`, { field: "serial" });
    throw error;
  }
}
