/** Words for measurement kinds, states and condition fields, shared by the tables and the set page. */
export const measurementKindLabels: Record<string, string> = {
  "drive-sweep": "Drive sweep",
  "frequency-sweep": "Frequency sweep",
  "two-tone": "Two-tone",
  "phase-noise": "Phase noise",
  touchstone: "S-parameters",
};

export function kindLabel(kind: string): string {
  return measurementKindLabels[kind] ?? kind;
}

export const stateLabels = { submitted: "Awaiting review", approved: "Approved", rejected: "Rejected" } as const;
export type SetState = keyof typeof stateLabels;
