/**
 * A device-class template: what a characterization sheet of that class shows.
 * Data plus a few small functions; lib/sheet reads it, the renderers never do.
 */

import type { DeviceClass } from "../lib/domain/device-classes";
import type { MeasurementKind } from "../lib/domain/measurements";
import type { LimitBasis, ProseSectionId } from "../lib/domain/sheets";
import type { StatedAnalysisSettings } from "../lib/domain/analysis-settings";
import type { DeriveOptions } from "../lib/analysis/types";
import type { ClassFieldWords, ConditionFieldId } from "../lib/domain/measurement-conditions";
import type { NameQualifier, ParameterName } from "../lib/domain/parameter-names";

export type { DeviceClass, LimitBasis, ProseSectionId };

/** How one condition value is written in a table cell. */
export type ConditionFormat =
  | "frequency" // Hz → GHz / MHz / kHz / Hz
  | "frequency-range" // two keys, start and stop in Hz → "1–3 GHz"
  | "frequency-band" // two keys decades apart, each end with its own prefix → "12 kHz–20 MHz"
  | "power-dbm"
  | "temperature-c"
  | "temperature-range" // two keys, lowest and highest set temperature in °C → "−40 to 85 °C"
  | "port"
  | "text";

export interface ConditionSource {
  /** Condition key of the derived parameter (or "temperatureC", taken from the measurement set). */
  key: string;
  /** Second key for "frequency-range": the stop frequency. */
  stopKey?: string;
  format: ConditionFormat;
  /** Written after the value, e.g. "in" / "out" to say which frequency it is. */
  suffix?: string;
  /**
   * Only in these rows (template row ids) / in every row but these: one condition key means different things
   * in different rows (a mixer's conversion loss holds over an RF band, a port's VSWR over the band its port
   * was swept over). A cell outside any row (a chart's caption) takes `exceptRows` sources and no `rows` one.
   */
  rows?: readonly string[];
  exceptRows?: readonly string[];
}

/** One condition column of the electrical-specifications table. A cell shows the first source present. */
export interface ConditionColumn {
  id: string;
  label: string;
  sources: ConditionSource[];
}

export interface SpecRowTemplate {
  /** Stable id within the template. */
  id: string;
  /** lib/analysis parameter name (parameterCatalog key): its label is the start of the row's name. */
  parameter: ParameterName;
  /**
   * What the row's name adds after the parameter's (lib/domain/parameter-names.ts specRowName composes it with
   * the harmonic order and path of `match` and "over temperature"): a row never spells a parameter's name.
   */
  qualifiers?: readonly NameQualifier[];
  symbol: string;
  unit: string;
  /** Decimals printed for limits and typical values (statistics get one more for s). */
  decimals: number;
  /** Conditions a derived parameter must carry, value for value, to belong to this row. */
  match?: Record<string, string | number>;
  /** Condition keys that split the row into groups; each group is one table line and one statistics entry. */
  groupBy: string[];
  defaultBasis: LimitBasis;
  /**
   * A row over temperature: the sets' temperatures are not split into groups; each unit's worst value
   * over the temperatures it was measured at ("max": its highest, "min": its lowest) is its value, and the
   * group carries the span of set temperatures as temperatureMinC and temperatureMaxC. Only units measured
   * at both ends of the span count (a unit measured at 25 °C alone is in the 25 °C rows, not here). Shown only
   * where the group's sets span two or more temperatures and some unit was measured at both ends.
   */
  overTemperature?: "max" | "min";
  /**
   * A row held at the drive its `match.drive` states (per-port dBm), not at each unit's optimum: each
   * unit's figure at its optimum (`drive: "optimum"`) is read again off the set's stored curve `curveId`
   * (x: per-port drive) at that drive, by linear interpolation between the two measured steps around it
   * (lib/sheet/stated-drive.ts). `series`: the curve's series by name; its first when absent.
   */
  atStatedDrive?: { curveId: string; series?: string };
}

export interface CurveTemplate {
  /** Stable chart id in the sheet. */
  id: string;
  /** lib/analysis curve id. */
  curveId: string;
  title: string;
  /** What the chart shows beyond the title; the sheet adds how many units are drawn. */
  caption: string;
  /** Keep only some series of the curve (by series name); all by default. */
  selectSeries?: (seriesName: string) => boolean;
  /** The parameter the y axis is named by when the kept series are one quantity of a curve that holds several (unit unchanged). */
  yParameter?: ParameterName;
}

/**
 * A chart of one derived parameter against a condition, across the approved sets: e.g.
 * conversion loss at optimum drive vs input frequency, one line per unit through its points.
 * Sets are grouped by temperature and the temperature with the most units is drawn.
 */
export interface TrendTemplate {
  /** Stable chart id in the sheet. */
  id: string;
  /** lib/analysis parameter name (parameterCatalog key). */
  parameter: ParameterName;
  /** Conditions the parameter must carry, value for value (as SpecRowTemplate.match). */
  match?: Record<string, string | number>;
  /** Each unit read off its stored sweep at the drive `match.drive` states (as SpecRowTemplate.atStatedDrive). */
  atStatedDrive?: SpecRowTemplate["atStatedDrive"];
  /**
   * The condition key on the x axis, with its axis words. "temperatureC" draws against each set's
   * temperature (the set's own condition, as the statistics read it) instead of picking one temperature.
   */
  x: { key: string; label: string; unit: string };
  /**
   * For a chart against temperature: condition keys that must agree along one line (e.g. the input
   * frequency); the group with the most units is drawn and named in the caption.
   */
  groupBy?: string[];
  /** The y axis: named as a row of the same parameter, match and qualifiers is (specRowName); the unit is the parameter's. */
  y: { unit: string; qualifiers?: readonly NameQualifier[] };
  title: string;
  caption: string;
}

export interface ProseTemplate {
  id: ProseSectionId;
  title: string;
  /** Markdown shown until the engineer writes the section. */
  markdown: string;
}

export interface AbsoluteMaximumRatingTemplate {
  /** Matched against SheetInput.absoluteMaximumRatings[].label; the value always comes from the device data. */
  label: string;
  unit: string;
}

/**
 * A class's conditions, in one place per class (templates/<class>/conditions.ts): what an upload
 * of this class states beside its file (the form's fields and the bench API's, in this order).
 */
export interface ClassConditions {
  uploadFields: readonly ConditionFieldId[];
  /**
   * The class's own words for a field where the shared ones (lib/domain/measurement-conditions.ts) say too
   * little: a multiplier's drive is stated per port. The upload form, the device form, the sheet's key facts
   * and the design-in calculator all read a field's words through classConditionField.
   */
  fieldWords?: ClassFieldWords;
  /**
   * Which condition field names the device's key input frequency and drive on the sheet, the device form and
   * the design-in calculator (a mixer's input is its RF, its drive the LO's); the shared input frequency and
   * drive level by default.
   */
  keyFields?: { inputFrequency?: ConditionFieldId; drive?: ConditionFieldId };
  /** The key input frequency's words where no upload field names it (a hybrid's range is its "Band"). */
  keyConditionWords?: { inputFrequency?: string };
}

/**
 * A frequency band the device states in its key conditions, and the condition keys by which the sheet's
 * rows say where in that band they are specified: a spot frequency, or a band's start and stop. Read by
 * the consistency checks (lib/sheet/consistency-checks.ts), which compare the two.
 */
export interface StatedBandTemplate {
  /** The device's key condition holding the band. */
  deviceKey: "inputFrequencyHz" | "outputFrequencyHz";
  /** The band's name in messages: "input band", "RF band". */
  label: string;
  /** Condition keys of a row in this band; a row takes the first source it carries. */
  sources: { key: string; stopKey?: string }[];
  /** Only these rows (template row ids) are in the band; every row carrying a source by default. */
  rowIds?: string[];
}

/** A note under the specifications table that explains some rows only. */
export interface SpecNoteTemplate {
  text: string;
  /** Template row ids: the note is printed when at least one of them is on the sheet. */
  rows: string[];
}

export interface SheetTemplate {
  /** A name from lib/domain/device-classes.ts, which also holds the class's human name. */
  deviceClass: DeviceClass;
  /**
   * The per-port drive (dBm) the rows and trends with `atStatedDrive` are held at: the device's own key
   * drive, or the class's default (findSheetTemplate). Absent for a class with no drive-held rows.
   */
  statedDriveDbm?: number;
  /** The class's conditions (templates/<class>/conditions.ts). */
  conditions: ClassConditions;
  /** Measurement kinds whose approved sets feed the sheet. */
  measurementKinds: MeasurementKind[];
  /**
   * The class neither amplifies nor generates power (diode mixers and multipliers, hybrids): its
   * files are refused or warned for values no passive part can produce (output above the input,
   * a negative loss, |S| above 0 dB; lib/ingest/plausibility.ts). false for a class with gain
   * (an amplifier, an active multiplier), whose files are not held to those bounds.
   */
  passive: boolean;
  specifications: {
    conditionColumns: ConditionColumn[];
    rows: SpecRowTemplate[];
    /**
     * Printed under the table, e.g. the reference impedance. A note about some rows names them (`rows`, template
     * row ids) and is printed only on a sheet where one of them has a figure: no jitter formula under a
     * table without jitter.
     */
    notes: (string | SpecNoteTemplate)[];
  };
  /** The bands the device states and how the rows name frequencies in them; none: the band is not checked. */
  statedBands?: StatedBandTemplate[];
  curves: CurveTemplate[];
  /** Parameter-against-condition charts, drawn after the curves; none by default. */
  trends?: TrendTemplate[];
  prose: ProseTemplate[];
  cautions: string[];
  absoluteMaximumRatings: AbsoluteMaximumRatingTemplate[];
  /**
   * What the workspace offers to fill in for a designer: the class's usual pins and the recommended
   * operating conditions (parameter and unit; the figures always come from the engineer).
   */
  designIn?: { pins: { pin: string; name: string; function: string }[]; recommendedOperatingConditions: { parameter: string; unit: string }[] };
  /** How the engine reads this class's files where the kind alone does not say (a mixer's Touchstone file is port match only). */
  deriveOptions?: Pick<DeriveOptions, "touchstone">;
  /**
   * The class's default measurement settings (the last source, after the file, the upload and the
   * command line): e.g. the phase-noise integration band for rms phase and jitter.
   */
  analysisDefaults?: StatedAnalysisSettings;
}
