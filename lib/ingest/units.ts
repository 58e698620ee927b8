/**
 * Units accepted in CSV headers and metadata, and their conversion to the
 * canonical unit of each quantity: Hz, dBm, dB, dBc, dBc/Hz, °C.
 */

export type Quantity = "frequency" | "power" | "ratio-db" | "relative-dbc" | "noise-dbc-hz" | "temperature";

export interface UnitConversion {
  /** The unit as written in the canonical spelling. */
  unit: string;
  quantity: Quantity;
  toCanonical: (value: number) => number;
  /** Values that cannot be converted (e.g. power ≤ 0 W), with the reason. */
  invalid?: (value: number) => string | undefined;
}

const identity = (x: number) => x;
const scale = (factor: number) => (x: number) => x * factor;
const positivePower = (x: number) => (x > 0 ? undefined : "a power in linear units must be greater than 0");

const FREQUENCY: UnitConversion[] = [
  { unit: "Hz", quantity: "frequency", toCanonical: identity },
  { unit: "kHz", quantity: "frequency", toCanonical: scale(1e3) },
  { unit: "MHz", quantity: "frequency", toCanonical: scale(1e6) },
  { unit: "GHz", quantity: "frequency", toCanonical: scale(1e9) },
];

// dBm = 10·log10(P / 1 mW)
const POWER: UnitConversion[] = [
  { unit: "dBm", quantity: "power", toCanonical: identity },
  { unit: "mW", quantity: "power", toCanonical: (x) => 10 * Math.log10(x), invalid: positivePower },
  { unit: "W", quantity: "power", toCanonical: (x) => 10 * Math.log10(x) + 30, invalid: positivePower },
];

const TEMPERATURE: UnitConversion[] = [
  { unit: "°C", quantity: "temperature", toCanonical: identity },
  // ITS-90 / SI: 0 °C = 273.15 K exactly
  { unit: "K", quantity: "temperature", toCanonical: (x) => x - 273.15 },
];

const BY_QUANTITY: Record<Quantity, UnitConversion[]> = {
  frequency: FREQUENCY,
  power: POWER,
  "ratio-db": [{ unit: "dB", quantity: "ratio-db", toCanonical: identity }],
  "relative-dbc": [{ unit: "dBc", quantity: "relative-dbc", toCanonical: identity }],
  "noise-dbc-hz": [{ unit: "dBc/Hz", quantity: "noise-dbc-hz", toCanonical: identity }],
  temperature: TEMPERATURE,
};

/** Spellings accepted for each unit; the lookup is by exact match after trimming. */
const ALIASES: Record<string, string> = {
  hz: "Hz",
  khz: "kHz",
  mhz: "MHz",
  ghz: "GHz",
  dbm: "dBm",
  mw: "mW",
  w: "W",
  db: "dB",
  dbc: "dBc",
  "dbc/hz": "dBc/Hz",
  c: "°C",
  degc: "°C",
  "°c": "°C",
  "deg c": "°C",
  k: "K",
};

/**
 * Frequency and decibel units are matched case-insensitively ("mhz" can only
 * mean MHz here: millihertz is never a bench frequency). Power in mW vs W and
 * kelvin are matched case-insensitively too, since "MW" (megawatt) is absurd.
 */
export function canonicalUnitSpelling(raw: string): string | undefined {
  return ALIASES[raw.trim().toLowerCase()];
}

export function findConversion(rawUnit: string, quantity: Quantity): UnitConversion | undefined {
  const spelled = canonicalUnitSpelling(rawUnit);
  if (spelled === undefined) return undefined;
  return BY_QUANTITY[quantity].find((u) => u.unit === spelled);
}

export function acceptedUnits(quantity: Quantity): string {
  return BY_QUANTITY[quantity].map((u) => (u.unit === "°C" ? "C, degC, °C" : u.unit)).join(", ");
}

export function describeQuantity(quantity: Quantity): string {
  switch (quantity) {
    case "frequency":
      return "a frequency";
    case "power":
      return "a power";
    case "ratio-db":
      return "a ratio in dB";
    case "relative-dbc":
      return "a level in dBc";
    case "noise-dbc-hz":
      return "a phase-noise density";
    case "temperature":
      return "a temperature";
  }
}

export interface ValueRange {
  min: number;
  max: number;
  /** Whether min itself is excluded (frequencies must be > 0). */
  minExclusive?: boolean;
  /** Canonical unit used to describe the range in messages. */
  unit: string;
  /** Overrides the generated description, e.g. "greater than 0 Hz and at most 3 THz". */
  text?: string;
}

/** Plausibility limits: a value outside is a unit mix-up or a corrupted file. */
export const RANGES = {
  powerDbm: { min: -200, max: 60, unit: "dBm" },
  frequencyHz: { min: 0, max: 3e12, minExclusive: true, unit: "Hz", text: "greater than 0 Hz and at most 3 THz" },
  noiseDbcHz: { min: -250, max: 0, unit: "dBc/Hz" },
  temperatureC: { min: -273.15, max: 500, unit: "°C" },
  lossDb: { min: -100, max: 300, unit: "dB" },
  correctionDb: { min: 0, max: 60, unit: "dB" },
  toneLevelDifferenceDb: { min: -40, max: 40, unit: "dB" },
  relativeDbc: { min: -300, max: 100, unit: "dBc" },
} satisfies Record<string, ValueRange>;

export function inRange(value: number, r: ValueRange): boolean {
  if (r.minExclusive ? value <= r.min : value < r.min) return false;
  return value <= r.max;
}

export function describeRange(r: ValueRange): string {
  if (r.text) return r.text;
  return `${r.minExclusive ? "greater than" : "from"} ${r.min} ${r.minExclusive ? "and at most" : "to"} ${r.max} ${r.unit}`;
}
