import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { SheetView } from "@/components/sheet/sheet-view";
import { SpecDataTable } from "@/components/sheets/spec-data-table";
import { buildSheetModel } from "@/lib/sheet";
import { loadDoublerInput } from "./fixture";

const model = buildSheetModel(loadDoublerInput());
const { specifications, statistics } = model;
// Parameter, Symbol, the condition columns, Min, Typ, Max, Unit, Basis.
const sheetColumnCount = 2 + specifications.conditionColumns.length + 5;

/** As React writes text into an attribute. */
const escaped = (text: string) => text.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;").replace(/'/g, "&#x27;");
const headCells = (table: string) => (table.split("<thead>")[1].split("</thead>")[0].match(/<th[ >]/g) ?? []).length;
/** Each body row's markup after "<tr": its attributes, then its cells. */
const bodyRows = (table: string) => table.split("<tbody>")[1].split("</tbody>")[0].split("<tr").slice(1);
const cellCount = (row: string) => (row.match(/<t[dh][ >]/g) ?? []).length;

function sheetTable(): string {
  const html = renderToStaticMarkup(createElement(SheetView, { model }));
  const section = html.split('<section aria-labelledby="sheet-specifications"')[1].split("</section>")[0];
  return section.slice(section.indexOf("<table"), section.indexOf("</table>"));
}

function workspaceTable(openGroupId: string | null): string {
  return renderToStaticMarkup(createElement(SpecDataTable, { model, openGroupId, onOpen: () => {} }));
}

describe("the specifications table, on the sheet and in the workspace", () => {
  it("has the fixture's variety: flagged rows, footnotes and empty figures", () => {
    expect(specifications.rows.length).toBeGreaterThan(3);
    expect(specifications.rows.some((row) => !row.supported)).toBe(true);
    expect(specifications.rows.some((row) => row.footnoteMarks.length > 0)).toBe(true);
    expect(specifications.rows.some((row) => row.min.text === "")).toBe(true);
  });

  it("draws the sheet's columns only when no hook is given: no button, no row attributes", () => {
    const table = sheetTable();
    expect(headCells(table)).toBe(sheetColumnCount);
    const rows = bodyRows(table);
    expect(rows).toHaveLength(specifications.rows.length);
    for (const row of rows) {
      expect(row.startsWith(">")).toBe(true);
      expect(cellCount(row)).toBe(sheetColumnCount);
    }
    expect(table).not.toContain("<button");
    expect(table).not.toContain("<caption");
  });

  it("gives the workspace the sheet's rows, plus n, Cpk, a data button and figures that open the data", () => {
    const open = specifications.rows[1].groupId;
    const table = workspaceTable(open);
    expect(table).toContain('data-testid="spec-data-table"');
    expect(table).toContain("<caption>");
    expect(headCells(table)).toBe(sheetColumnCount + 3);

    const sheetRows = bodyRows(sheetTable());
    const rows = bodyRows(table);
    expect(rows).toHaveLength(specifications.rows.length);
    specifications.rows.forEach((spec, i) => {
      const row = rows[i];
      const where = spec.conditions.filter(Boolean).join(", ");
      expect(row.startsWith(` data-group-id="${escaped(spec.groupId)}"${spec.groupId === open ? ' aria-current="true"' : ""} class=`)).toBe(true);
      expect(cellCount(row)).toBe(sheetColumnCount + 3);
      expect(row).toContain(`aria-label="${escaped(`Data for ${spec.label}${where ? `, ${where}` : ""}`)}" data-testid="spec-data-button"`);
      const stated = (["min", "typ", "max"] as const).filter((which) => spec[which].text !== "");
      expect(row.match(/data-testid="spec-value"/g) ?? []).toHaveLength(stated.length);
      for (const which of stated) {
        expect(row).toContain(`aria-label="${escaped(`${spec.label} ${which} ${spec[which].text} ${spec.unit}${where ? `, ${where}` : ""}: show data`)}"`);
      }
      const group = statistics.groups.find((g) => g.groupId === spec.groupId)!;
      expect(row).toContain(`<td class="num figure">${spec.n}</td>`);
      if (group.cpk.text) expect(row).toContain(`>${escaped(group.cpk.text)}</td>`);

      // Without the row attributes, the figure buttons and the three added cells, the row is the sheet's own.
      const withoutHook = row
        .replace(/^ data-group-id="[^"]*"( aria-current="true")? class="[^"]*">/, ">")
        .replace(/<button type="button" aria-label="[^"]*" class="[^"]*" data-testid="spec-value">([^<]*)<\/button>/g, "$1");
      const cellStarts = [...withoutHook.matchAll(/<td[ >]/g)].map((m) => m.index);
      expect(withoutHook.slice(0, cellStarts[cellStarts.length - 3])).toBe(sheetRows[i].replace(/<\/tr>$/, ""));
    });
    expect(table.match(/aria-current="true"/g)).toHaveLength(1);
  });

  it("says so in the workspace when there are no rows yet", () => {
    const empty = { ...model, specifications: { ...specifications, rows: [] } };
    const html = renderToStaticMarkup(createElement(SpecDataTable, { model: empty, openGroupId: null, onOpen: () => {} }));
    expect(html).toContain('data-testid="spec-data-empty"');
    expect(html).not.toContain("<table");
  });
});
