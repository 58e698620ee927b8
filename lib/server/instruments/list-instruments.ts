import "server-only";
import { db } from "@/models";
import { toInstrumentSummary, type InstrumentSummary } from "./instrument-summary";

export async function listInstruments(organizationId: number): Promise<InstrumentSummary[]> {
  const { Instrument } = db();
  const rows = await Instrument.findAll({ where: { organizationId, retiredAt: null }, order: [["kind", "ASC"], ["serial", "ASC"]] });
  return rows.map((r) => toInstrumentSummary(r));
}
