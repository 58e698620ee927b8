import { toHz, type FrequencyUnit } from "@/components/devices/frequency-units";
import type { MappingDetail, MappingTarget } from "./upload-request";

/** What the file does not say, asked beside the mapping: the frequency and, for a sweep, the wanted order. */
export type MappingMetadata = { frequency: string; frequencyUnit: FrequencyUnit; wantedOrder: string };

export type Choice = { target: string; unit: string };

/** A first guess from the header text: "Pin_dBm" → input power in dBm, "Harm2 (dBm)" → output at 2×. */
export function guessTarget(header: string, targets: MappingTarget[]): Choice {
  const h = header.toLowerCase();
  const unitMatch = /(dbc\/hz|dbm|dbc|db|mw|w|ghz|mhz|khz|hz)\b/i.exec(header.replace(/[()[\]_]/g, " "));
  const find = (target: string) => targets.find((t) => t.target === target);
  let target: MappingTarget | undefined;
  const order = /(?:harm|h|p|order)\s*_?(\d+)/i.exec(h);
  if (/^(pin|p_in|input|drive|source)/.test(h) || /\bpin\b/.test(h)) target = find("input_power");
  else if (/fund/.test(h)) target = find("fund_out") ?? find("p1_out");
  else if (/im3|imd3/.test(h)) target = find("im3_out");
  else if (order) target = find(`p${order[1]}_out`);
  else if (/offset/.test(h)) target = find("offset");
  else if (/^l\b|l\(f\)|phase.?noise/.test(h)) target = find("L");
  else if (/freq/.test(h)) target = find("frequency");
  else if (/conv|loss/.test(h)) target = find("conversion_loss");
  else if (/pout|output/.test(h)) target = find("output_power");
  if (!target) return { target: "", unit: "" };
  const unitText = unitMatch?.[1];
  const unit = target.units.find((u) => u.toLowerCase() === unitText?.toLowerCase()) ?? target.units[0];
  return { target: target.target, unit };
}

/** Metadata a mapped file of this kind needs when the file itself does not state it (fixtures/FORMATS.md). */
export function metadataFor(kind: string, meta: MappingMetadata): Record<string, string> {
  const frequency = meta.frequency.trim() ? `${meta.frequency.trim()} ${meta.frequencyUnit}` : "";
  if (kind === "drive-sweep") return { ...(frequency ? { input_frequency: frequency } : {}), ...(meta.wantedOrder.trim() ? { wanted_order: meta.wantedOrder.trim() } : {}) };
  if (kind === "phase-noise") return frequency ? { carrier_frequency: frequency } : {};
  return {};
}

/** The kind whose quantities the headers suggest best (the first kind on a tie). */
export function likeliestKind(detail: MappingDetail): string {
  const kinds = Object.keys(detail.targets);
  let best = kinds[0] ?? "";
  let bestScore = -1;
  for (const k of kinds) {
    const score = detail.headers.filter((h) => guessTarget(h, detail.targets[k]).target !== "").length;
    if (score > bestScore) {
      best = k;
      bestScore = score;
    }
  }
  return best;
}

/** What stops the mapping from being saved, in the words the panel shows. */
export function findMappingProblems({ choices, targets, name, kind, metadata }: { choices: Choice[]; targets: MappingTarget[]; name: string; kind: string; metadata: MappingMetadata }): string[] {
  const labelOf = (target: string) => targets.find((t) => t.target === target)?.label ?? target;
  const found: string[] = [];
  const used = new Map<string, number>();
  choices.forEach((c) => c.target && used.set(c.target, (used.get(c.target) ?? 0) + 1));
  for (const [target, count] of used) if (count > 1) found.push(`${labelOf(target)} is chosen for ${count} columns; pick one.`);
  for (const t of targets) if (t.required && !used.has(t.target)) found.push(`Map a column to ${t.label}.`);
  if (used.size === 0) found.push("Map at least one column.");
  if (name.trim().length < 2) found.push("Name the mapping (at least 2 characters).");
  const hz = toHz(metadata.frequency, metadata.frequencyUnit);
  if (hz !== undefined && !(hz > 0)) found.push("The frequency must be a number above 0.");
  if (kind === "drive-sweep" && metadata.wantedOrder.trim() !== "" && !/^\d+$/.test(metadata.wantedOrder.trim())) found.push("The wanted order is a whole number (2 for a doubler).");
  return found;
}
