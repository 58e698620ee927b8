import { describe, expect, it } from "vitest";
import { releasedSpecValues } from "@/lib/catalog/released-spec-values";
import { doublerCandidateAndRelease } from "../sheet/released-fixture";

describe("releasedSpecValues", () => {
  it("gives one entry per specification row and condition group, with the limits as numbers in the row's unit", () => {
    const { released } = doublerCandidateAndRelease();
    const values = releasedSpecValues(released);
    expect(values).toHaveLength(released.specifications.rows.length);
    values.forEach((v, i) => {
      const row = released.specifications.rows[i];
      expect(v).toEqual({ rowId: row.rowId, parameter: row.parameter, conditionsKey: row.conditionsKey, min: row.min.value, typ: row.typ.value, max: row.max.value, unit: row.unit });
    });
    // The fixture states limits: at least one figure of each kind is a number, not text.
    expect(values.some((v) => typeof v.max === "number")).toBe(true);
    expect(values.some((v) => typeof v.typ === "number")).toBe(true);
  });

  it("stores an absent limit as null, never as 0", () => {
    const { released } = doublerCandidateAndRelease();
    const row = { ...released.specifications.rows[0], min: { value: null, text: "" }, max: { value: Number.NaN, text: "" } };
    const [value] = releasedSpecValues({ ...released, specifications: { ...released.specifications, rows: [row] } });
    expect(value.min).toBeNull();
    expect(value.max).toBeNull();
  });
});
