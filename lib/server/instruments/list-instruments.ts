import "server-only";
import { Instrument, getSequelize } from "@/models";
import { toInstrumentSummary, type InstrumentSummary } from "./instrument-summary";

export async function listInstruments(organizationId: number): Promise<InstrumentSummary[]> {
  getSequelize();
  const rows = await Instrument.findAll({ where: { organizationId, retiredAt: null }, order: [["kind", "ASC"], ["serial", "ASC"]] });
  return rows.map((r) => toInstrumentSummary(r));
}
