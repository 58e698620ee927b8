import { readdirSync, readFileSync, statSync } from "node:fs";
import { join } from "node:path";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));
import { ParametersTable } from "@/components/measurements/set-parameters-table";
import { parameterCatalog } from "@/lib/analysis/catalog";
import type { DerivedParameter } from "@/lib/analysis/types";
import { catalogParameters } from "@/lib/catalog/catalog-query";
import { catalogKeyColumns, keyColumnHead } from "@/lib/catalog/key-columns";
import { seriesLabel } from "@/lib/charts/styles";
import { deviceClasses } from "@/lib/domain/device-classes";
import { composeParameterName, harmonicOrderName, harmonicSuppressionLabel, nameQualifierWords, specRowName } from "@/lib/domain/parameter-names";
import { buildSheetModel } from "@/lib/sheet";
import { findSheetTemplate, frequencyMultiplierTemplate } from "@/templates";
import { demoSheetInputs } from "../sheet/demo-inputs";

/** The set page's name of one derived figure: the text of its row header. */
function setPageName(parameter: DerivedParameter): string {
  const html = renderToStaticMarkup(createElement(ParametersTable, { parameters: [parameter] }));
  const th = /<th scope="row"[^>]*>([^<]*)<\/th>/.exec(html);
  if (!th) throw new Error(`no row header in ${html}`);
  return th[1].replace(/&amp;/g, "&");
}

describe("one name per harmonic order, on the set page, the sheet and the charts", () => {
  it.each([
    [1, "fundamental"],
    [2, "2nd harmonic"],
    [3, "3rd harmonic"],
    [4, "4th harmonic"],
    [11, "11th harmonic"],
    [12, "12th harmonic"],
    [21, "21st harmonic"],
  ])("order %i is the %s", (order, name) => expect(harmonicOrderName(order)).toBe(name));

  it("names a suppression row of the sheet, its chart legend and the set page's parameter alike", () => {
    for (const order of [1, 3, 4]) {
      const row = frequencyMultiplierTemplate.specifications.rows.find((r) => r.parameter === "harmonic-suppression" && r.match?.order === order)!;
      const name = specRowName(row);
      expect(name).toBe(harmonicSuppressionLabel(order));
      expect(name.toLowerCase()).toContain(seriesLabel(`order ${order}`).replace(/ \(×\d+\)$/, ""));
      expect(setPageName({ name: "harmonic-suppression", value: 25, unit: "dBc", conditions: { order, inputFrequencyHz: 1e9, drive: "optimum" } })).toBe(name);
    }
  });
});

describe("a chart legend names a path as the rows do", () => {
  it.each([
    ["order 3", "3rd harmonic (×3)"],
    ["insertion loss S21", "Insertion loss S21"],
    ["isolation S41", "Isolation S41"],
    ["LO-RF", "LO\u2013RF"],
    ["port 2", "port 2"],
  ])("%s reads %s, and reading it again changes nothing (a frozen model's legend meets today's)", (engine, legend) => {
    expect(seriesLabel(engine)).toBe(legend);
    expect(seriesLabel(legend)).toBe(legend);
  });
});

describe("a name composed of the parameter's and the row's qualifiers", () => {
  it.each([
    [{ parameter: "conversion-loss" }, "Conversion loss"],
    [{ parameter: "conversion-loss", overTemperature: "max" as const, qualifiers: ["highest-in-band" as const] }, "Conversion loss over temperature, highest in band"],
    [{ parameter: "optimum-drive", qualifiers: ["per-port" as const] }, "Optimum drive, per port"],
    [{ parameter: "isolation", match: { path: "LO-RF", statistic: "min" } }, "Isolation LO\u2013RF"],
    [{ parameter: "insertion-loss", match: { path: "S21" } }, "Insertion loss, port 1 to 2 (S21)"],
    [{ parameter: "isolation", match: { path: "S32" } }, "Isolation, port 2 to 3 (S32)"],
    [{ parameter: "harmonic-suppression", match: { order: 3, drive: 10 } }, "3rd harmonic suppression"],
    [{ parameter: "iip3" }, "Input IP3"],
    [{ parameter: "spot-phase-noise" }, "Phase noise"],
  ])("%j reads %s", (row, name) => expect(specRowName(row)).toBe(name));
});

/**
 * Where a name could be typed a second time: a template's row, trend or curve, the catalog's columns and
 * compare, the set page. A `label:` (or any string) there that starts with a parameter's name spells it.
 */
const NAMES = [
  ...Object.values(parameterCatalog).map((p) => p.label),
  ...[1, 2, 3, 4, 5, 6].map(harmonicSuppressionLabel),
];
const escape = (text: string) => text.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
// As written, or inside a sentence with its first letter lowered ("conversion loss"); a one-word name only as
// written, since the machine names ("isolation", "vswr") are strings too.
const SPELLINGS = NAMES.flatMap((n) => (n.includes(" ") && /^[A-Z][a-z]/.test(n) ? [n, `${n[0].toLowerCase()}${n.slice(1)}`] : [n])).map(escape).join("|");
const NAMED = new RegExp(`(?:label|yLabel)\\s*:\\s*["'\`](${SPELLINGS})\\b|(?<!(?:symbol:|startsWith\\()\\s*)["'\`](${SPELLINGS})["'\`]`, "g");

function spelledNames(source: string): string[] {
  return [...source.matchAll(NAMED)].map((m) => m[1] ?? m[2]);
}

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((entry) => {
    const path = join(dir, entry);
    return statSync(path).isDirectory() ? sourceFiles(path) : /\.tsx?$/.test(entry) ? [path] : [];
  });
}

const GUARDED = [
  ...sourceFiles("templates"),
  ...sourceFiles("lib/catalog"),
  "components/measurements/set-parameters-table.tsx",
  "components/measurements/parameter-conditions.ts",
  "components/catalog/catalog-view.tsx",
  "components/catalog/compare-view.tsx",
];

describe("no surface spells a parameter's name itself", () => {
  it("finds a name typed in a row's label, an axis label or a bare string (the check can fail)", () => {
    expect(spelledNames(`{ id: "x", label: "Conversion loss, highest in band" }`)).toEqual(["Conversion loss"]);
    expect(spelledNames(`y: { label: "RMS jitter", unit: "fs" }`)).toEqual(["RMS jitter"]);
    expect(spelledNames(`<th>{"3rd harmonic suppression"}</th>`)).toEqual(["3rd harmonic suppression"]);
    expect(spelledNames(`{ key: "conversion-loss", title: "Conversion loss vs drive" }`)).toEqual([]);
    expect(spelledNames(`{ parameter: "vswr", symbol: "VSWR", select: (n) => n.startsWith("insertion loss") }`)).toEqual([]);
  });

  it.each(GUARDED)("%s takes every parameter's name from lib/domain/parameter-names.ts", (file) => {
    expect(spelledNames(readFileSync(file, "utf8"))).toEqual([]);
  });

  it("the catalog's key columns carry the template row's name and symbol", () => {
    for (const deviceClass of deviceClasses) {
      const rows = findSheetTemplate(deviceClass)?.specifications.rows ?? [];
      for (const column of catalogKeyColumns[deviceClass]) {
        const row = rows.find((r) => r.id === column.key) ?? rows.find((r) => r.parameter === column.key);
        expect(row, `${deviceClass} ${column.key}`).toBeDefined();
        expect(keyColumnHead(column.key).symbol).toBe(row!.symbol);
        expect(keyColumnHead(column.key).name).toBe(catalogParameters().get(column.key)!.label);
        const byParameter = catalogParameters().get(column.key)!.column === "parameter";
        expect(byParameter ? composeParameterName(row!.parameter) : specRowName(row!)).toBe(keyColumnHead(column.key).name);
      }
    }
  });
});

describe("the set page and the sheet name a figure alike", () => {
  const qualifierTail = new RegExp(`^( over temperature)?(, (${Object.values(nameQualifierWords).map(escape).join("|")}))*$`);

  // The demo parts with approved sets (the catalog's other demo parts have no data, hence no rows).
  for (const { partNumber, input } of demoSheetInputs("2026-12-01").filter(({ input }) => input.approvedSets.length > 0)) {
    it(`${partNumber}: each row of the sheet begins with the set page's name of the figures it is made of`, () => {
      const model = buildSheetModel(input);
      const template = findSheetTemplate(input.device.deviceClass)!;
      for (const row of model.specifications.rows) {
        const rowTemplate = template.specifications.rows.find((r) => r.id === row.rowId)!;
        const figure = input.approvedSets
          .flatMap((set) => set.parameters)
          .find((p) => p.name === rowTemplate.parameter && Object.entries(rowTemplate.match ?? {}).every(([k, v]) => k === "drive" || p.conditions[k] === v));
        expect(figure, `${partNumber} ${row.rowId}: a set carries its figure`).toBeDefined();
        const onSetPage = setPageName(figure!);
        expect(row.label.startsWith(onSetPage), `${row.label} / ${onSetPage}`).toBe(true);
        expect(row.label.slice(onSetPage.length)).toMatch(qualifierTail);
      }
    });
  }
});
