import type { AbsoluteMaximumRatingTemplate, ConditionColumn, LimitBasis, ProseTemplate, SpecRowTemplate } from "./types";
import { proseSectionTitles } from "../lib/domain/sheets";

/** The cautions every class carries (the usual datasheet cautions: ESD, maximum RF input, limits only under the stated conditions; sign-off defers to the organization's own procedures); a class adds its own RF-power wording. */
export function composeCautions(maximumInputPowerCaution: string): string[] {
  return [
    "Electrostatic-discharge-sensitive device. Handle it at an ESD-protected workstation with grounded wrist straps and " +
      "conductive packaging. The device's class per ANSI/ESDA/JEDEC JS-001 (human-body model) is stated by the maker under " +
      "absolute maximum ratings.",
    maximumInputPowerCaution,
    "Limits apply only under the conditions stated with them. Outside those conditions the figures are not specified.",
    "Stresses beyond the absolute maximum ratings may damage the device permanently; operation at those ratings is not implied.",
    "This sheet does not replace the organization's own quality procedures: incoming inspection, acceptance and sign-off " +
      "follow those procedures.",
  ];
}

export const temperatureColumn: ConditionColumn = {
  id: "temperature",
  label: "T_A",
  // A row over temperature carries the span of its sets' temperatures instead of one.
  sources: [
    { key: "temperatureC", format: "temperature-c" },
    { key: "temperatureMinC", stopKey: "temperatureMaxC", format: "temperature-range" },
  ],
};

/** Condition keys of a figure taken over a whole band (lib/analysis "worst" and min/typ/max figures). */
export const bandKeys = ["startHz", "stopHz"];

export const bandColumn: ConditionColumn = {
  id: "band",
  label: "Band",
  sources: [{ key: "startHz", stopKey: "stopHz", format: "frequency-range" }],
};

export const portColumn: ConditionColumn = {
  id: "port",
  label: "Port",
  sources: [{ key: "port", format: "port" }],
};

/** The highest VSWR over the band, one line per port: every class measured with a network analyzer. */
export function worstVswrRow(defaultBasis: LimitBasis): SpecRowTemplate {
  return {
    id: "vswr",
    parameter: "vswr",
    qualifiers: ["highest-in-band"],
    symbol: "VSWR",
    unit: ":1",
    decimals: 2,
    match: { statistic: "worst" },
    groupBy: ["port", ...bandKeys, "temperatureC"],
    defaultBasis,
  };
}

export const esdRating: AbsoluteMaximumRatingTemplate = {
  label: "ESD sensitivity, human-body model (ANSI/ESDA/JEDEC JS-001)",
  unit: "class",
};

export const temperatureRatings: AbsoluteMaximumRatingTemplate[] = [
  { label: "Operating temperature", unit: "°C" },
  { label: "Storage temperature", unit: "°C" },
];

export function composeProse(sections: {
  description: string;
  features: string;
  applications: string;
  handling: string;
  testFixture: string;
}): ProseTemplate[] {
  return [
    { id: "description", title: proseSectionTitles["description"], markdown: sections.description },
    { id: "features", title: proseSectionTitles["features"], markdown: sections.features },
    { id: "applications", title: proseSectionTitles["applications"], markdown: sections.applications },
    { id: "handling", title: proseSectionTitles["handling"], markdown: sections.handling },
    { id: "test-fixture", title: proseSectionTitles["test-fixture"], markdown: sections.testFixture },
  ];
}

export const defaultHandlingProse =
  "Keep the device in its conductive packaging until it is mounted. Ground the work surface, the soldering iron " +
  "and the operator. Follow the maker's reflow profile; do not exceed the storage temperature.";
