import { describe, expect, it } from "vitest";
import { proseLayout } from "@/lib/sheet/prose-layout";
import type { ProseSection } from "@/lib/sheet/types";

const section = (id: ProseSection["id"]): ProseSection => ({ id, title: id, html: "", blocks: [], isDefault: false });

describe("proseLayout", () => {
  it("puts description and features first and keeps every other section in the model's order", () => {
    const layout = proseLayout([section("applications"), section("features"), section("test-fixture"), section("description")]);
    expect(layout.description?.id).toBe("description");
    expect(layout.features?.id).toBe("features");
    expect(layout.later.map((s) => s.id)).toEqual(["applications", "test-fixture"]);
  });

  it("leaves a missing opening section undefined", () => {
    const layout = proseLayout([section("applications")]);
    expect(layout.description).toBeUndefined();
    expect(layout.features).toBeUndefined();
    expect(layout.later.map((s) => s.id)).toEqual(["applications"]);
  });
});
