import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { ParametersTable } from "@/components/measurements/set-parameters-table";
import { seriesLabel } from "@/lib/charts/styles";
import { harmonicOrderName, harmonicSuppressionLabel } from "@/lib/domain/parameter-names";
import { frequencyMultiplierTemplate } from "@/templates";

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
      expect(row.label).toBe(harmonicSuppressionLabel(order));
      expect(row.label.toLowerCase()).toContain(seriesLabel(`order ${order}`).replace(/ \(×\d+\)$/, ""));
      const html = renderToStaticMarkup(
        createElement(ParametersTable, { parameters: [{ name: "harmonic-suppression", value: 25, unit: "dBc", conditions: { order, inputFrequencyHz: 1e9, drive: "optimum" } }] }),
      );
      expect(html).toContain(`>${row.label}</th>`);
    }
  });
});
