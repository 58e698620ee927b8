/**
 * The conditions an upload (the form or the bench API) may state beside the file, once each: their
 * field names, words, units and bounds. Which of them a device class asks for is the class's own
 * list in templates/<class>/conditions.ts (read through templates/upload-conditions.ts); the zod
 * schema, the form and the OpenAPI document derive from these entries.
 *
 * Pure data: server code and client components both import it.
 */
export const conditionFieldIds = [
  "inputFrequencyHz",
  "driveLevelDbm",
  "splitterExcessLossDb",
  "cableLossDb",
  "rfFrequencyHz",
  "loFrequencyHz",
  "ifFrequencyHz",
  "loDriveDbm",
  "bandStartHz",
  "bandStopHz",
] as const;
export type ConditionFieldId = (typeof conditionFieldIds)[number];

/** How the form takes a value: a frequency with a unit select, or a number in a fixed unit. */
export type ConditionFieldKind = "frequency" | "power-dbm" | "loss-db";

export interface ConditionField {
  /** The words on the form and in the API's description. */
  label: string;
  kind: ConditionFieldKind;
  /** The unit the API takes (Hz, dBm, dB). */
  unit: "Hz" | "dBm" | "dB";
  min: number;
  max: number;
  hint?: string;
}

const frequency = (label: string, hint?: string): ConditionField => ({ label, kind: "frequency", unit: "Hz", min: 1, max: 3e12, ...(hint ? { hint } : {}) });
const power = (label: string, hint?: string): ConditionField => ({ label, kind: "power-dbm", unit: "dBm", min: -200, max: 60, ...(hint ? { hint } : {}) });
const loss = (label: string, hint?: string): ConditionField => ({ label, kind: "loss-db", unit: "dB", min: 0, max: 30, ...(hint ? { hint } : {}) });

export const conditionFields: Record<ConditionFieldId, ConditionField> = {
  inputFrequencyHz: frequency("Input frequency"),
  driveLevelDbm: power("Drive level"),
  splitterExcessLossDb: loss("Splitter excess loss", "Beyond the ideal 3.01 dB split"),
  cableLossDb: loss("Cable loss"),
  rfFrequencyHz: frequency("RF frequency", "A spot measurement's RF; a sweep's band comes from the file"),
  loFrequencyHz: frequency("LO frequency"),
  ifFrequencyHz: frequency("IF frequency"),
  loDriveDbm: power("LO drive", "Available power at the LO port"),
  bandStartHz: frequency("Band start"),
  bandStopHz: frequency("Band stop"),
};

/** "lower edge, upper edge" pairs an upload must state together, the lower not above the upper. */
export const conditionFieldPairs: readonly (readonly [ConditionFieldId, ConditionFieldId])[] = [["bandStartHz", "bandStopHz"]];

/** The API's words for a field: "LO drive (dBm)". */
export function conditionFieldLabel(id: ConditionFieldId): string {
  const field = conditionFields[id];
  return `${field.label.toLowerCase().replace(/^(lo|rf|if) /, (m) => m.toUpperCase())} (${field.unit})`;
}

/** A class's own words for some of its fields (templates/<class>/conditions.ts `fieldWords`): label and hint. */
export type ClassFieldWords = Partial<Record<ConditionFieldId, { label: string; hint?: string }>>;

/** What a class says of its conditions' words: its own words for some fields, and which fields are its key input frequency and drive. */
export interface ClassConditionWords {
  fieldWords?: ClassFieldWords;
  keyFields?: { inputFrequency?: ConditionFieldId; drive?: ConditionFieldId };
  keyConditionWords?: { inputFrequency?: string };
}

/** A field as a class states it: the shared entry with the class's own label and hint ("Drive level, per port" for a multiplier). */
export function classConditionField(words: ClassConditionWords | undefined, id: ConditionFieldId): ConditionField {
  const own = words?.fieldWords?.[id];
  return own ? { ...conditionFields[id], label: own.label, ...(own.hint ? { hint: own.hint } : {}) } : conditionFields[id];
}

/**
 * The field naming a device's key input frequency or drive for a class (a mixer's RF frequency and LO drive;
 * the input frequency and drive level otherwise), as the class words it.
 */
export function keyConditionField(words: ClassConditionWords | undefined, key: "inputFrequency" | "drive"): ConditionField {
  const id = words?.keyFields?.[key] ?? (key === "drive" ? "driveLevelDbm" : "inputFrequencyHz");
  const field = classConditionField(words, id);
  const own = key === "inputFrequency" ? words?.keyConditionWords?.inputFrequency : undefined;
  return own ? { ...field, label: own } : field;
}
