import { formatNumber, quantityParts } from "@/lib/format";
import { settingSourceWords, type SettingSource } from "@/lib/domain/analysis-settings";

/**
 * A derived parameter's conditions in words with units: `inputFrequencyHz: 1e9` → "input frequency 1 GHz".
 * The unit is read from the key's suffix, the same convention the engine names them by.
 */
const suffixes: [RegExp, string][] = [
  [/Hz$/, "Hz"],
  [/Dbm$/, "dBm"],
  [/DbcHz$/, "dBc/Hz"],
  [/Dbc$/, "dBc"],
  [/Db$/, "dB"],
  [/Deg$/, "°"],
  [/C$/, "°C"],
  [/K$/, "K"],
];

const names: Record<string, string> = {
  inputFrequencyHz: "input frequency",
  carrierFrequencyHz: "carrier",
  frequencyHz: "at",
  offsetHz: "offset",
  startHz: "from",
  stopHz: "to",
  inputPowerDbm: "input",
  maxInputPowerDbm: "fit up to",
  nominalDeg: "nominal",
  temperatureK: "T",
  ktDbmHz: "kT",
  statistic: "",
  drive: "drive",
  order: "order",
  bandSource: "band set by",
  referenceDbm: "gain reference at",
  referencePoints: "reference steps",
  referenceSource: "reference set by",
  tone2RelativeLevelDb: "tone 2 relative",
  product: "product",
  noiseBandwidthHz: "noise bandwidth",
  resolutionBandwidthHz: "RBW",
  bandwidthSource: "bandwidth set by",
};

/** Condition values that name where a setting came from are printed in words. */
const sourceKeys = new Set(["bandSource", "referenceSource", "bandwidthSource"]);

function words(key: string): string {
  if (key in names) return names[key];
  const stem = key.replace(/(DbcHz|DbmHz|Dbm|Dbc|Db|Hz|Deg)$/, "");
  return stem.replace(/([A-Z])/g, " $1").toLowerCase().trim();
}

export type ConditionPart = { label: string; value: string; unit?: string };

export function describeConditions(conditions: Record<string, string | number>): ConditionPart[] {
  const parts: ConditionPart[] = [];
  for (const [key, raw] of Object.entries(conditions)) {
    const label = words(key);
    if (typeof raw === "string") {
      parts.push({ label, value: sourceKeys.has(key) && raw in settingSourceWords ? settingSourceWords[raw as SettingSource] : raw });
      continue;
    }
    if (key === "ktDbmHz") {
      parts.push({ label, ...quantityParts(raw, "dBm/Hz", { digits: { maxDecimals: 1 } }) });
      continue;
    }
    if (/Hz$/.test(key) && !/DbcHz$|DbmHz$/.test(key)) {
      parts.push({ label, ...quantityParts(raw, "Hz") });
      continue;
    }
    const suffix = suffixes.find(([re]) => re.test(key));
    parts.push({ label, value: formatNumber(raw, { signed: suffix?.[1] === "dBm" }), unit: suffix?.[1] });
  }
  return parts;
}
