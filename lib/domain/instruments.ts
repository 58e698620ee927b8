/** Instruments and bench tokens as the admin pages show them. Pure: components import these types. */

/** One stated uncertainty of an instrument, with its coverage factor (k = 2 by default). */
export type InstrumentUncertainty = { quantity: string; value: number; unit: string; coverageFactor: number };

export type InstrumentSummary = {
  id: number;
  kind: string;
  model: string;
  serial: string;
  calibratedOn: string;
  calibrationDueOn: string;
  /** Due date already passed today. */
  calibrationOverdue: boolean;
  uncertainty: InstrumentUncertainty[];
};

export type BenchTokenSummary = { id: number; name: string; prefix: string; createdAt: string; lastUsedAt: string | null; revokedAt: string | null };
