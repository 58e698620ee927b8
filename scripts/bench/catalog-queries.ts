/**
 * The searches the catalog benchmark sends (scripts/bench/catalog-load.ts): one typical parametric
 * query, and a seeded set of different ones, all of them queries the catalog's parser accepts.
 */
import { mulberry32 } from "../../lib/stats/seeded-random";

export const typicalSearch = new URLSearchParams([
  ["class", "frequency-multiplier"],
  ["covers", "2.4 GHz"],
  ["f", "conversion-loss.max<=10 dB"],
  ["f", "fundamental-suppression>=25 dBc"],
  ["sort", "conversion-loss.max"],
]).toString();

/** 400 different searches an RF designer might type: class, band, limits with units, sort, page. */
export function distinctSearches(count = 400): string[] {
  const random = mulberry32(7);
  const pick = <T>(list: readonly T[]) => list[Math.floor(random() * list.length)];
  const conditions: Record<string, string[]> = {
    "frequency-multiplier": ["conversion-loss.max<={x} dB", "fundamental-suppression>={y} dBc", "drive<=+{d} dBm", "third-harmonic-suppression>={y} dBc"],
    "double-balanced-mixer": ["conversion-loss.max<={x} dB", "isolation-lo-rf>={y} dB", "vswr.max<=1.{v}", "iip3>={d} dBm"],
    "quadrature-hybrid": ["insertion-loss.max<=0.{v} dB", "amplitude-balance.max<=0.{v} dB", "vswr.max<=1.{v}", "isolation>={y} dB"],
  };
  const sorts = ["part", "released", "drive", "conversion-loss.max", "conversion-loss.typ"];
  const found = new Set<string>();
  while (found.size < count) {
    const deviceClass = pick([...Object.keys(conditions), ""]);
    const q = new URLSearchParams();
    if (deviceClass) q.set("class", deviceClass);
    if (random() < 0.6) q.set("covers", `${pick(["900 MHz", "1.5 GHz", "2.4 GHz", "5.8 GHz", "8 GHz", "12 GHz", "18 GHz"])}`);
    const pool = deviceClass ? conditions[deviceClass] : ["drive<=+{d} dBm"];
    for (let i = 0, n = Math.floor(random() * 3); i < n; i++) {
      q.append(
        "f",
        pick(pool)
          .replace("{x}", String(6 + Math.floor(random() * 7)))
          .replace("{y}", String(15 + Math.floor(random() * 25)))
          .replace("{d}", String(8 + Math.floor(random() * 12)))
          .replace("{v}", String(2 + Math.floor(random() * 7))),
      );
    }
    const sort = pick(sorts);
    if (sort !== "part") q.set("sort", sort);
    if (random() < 0.3) q.set("dir", "desc");
    if (random() < 0.2) q.set("page", "2");
    found.add(q.toString());
  }
  return [...found];
}
