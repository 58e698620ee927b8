import { describe, expect, it } from "vitest";
import { can, navigationFor, roles } from "@/lib/domain/permissions";

describe("navigation follows the role → permission table", () => {
  it.each([
    ["admin", ["Devices", "People", "Instruments", "Bench tokens", "Catalog"]],
    ["engineer", ["Devices", "Sheets", "Catalog"]],
    ["reviewer", ["Devices", "Sheets", "Review queue", "Catalog"]],
    ["customer", ["Catalog", "Change notices"]],
  ] as const)("%s sees %j", (role, labels) => {
    expect(navigationFor(role).map((i) => i.label)).toEqual(labels);
  });

  it("shows signed-out visitors the catalog only", () => {
    expect(navigationFor(null).map((i) => i.href)).toEqual(["/catalog"]);
  });

  it("never lets a customer write or review", () => {
    for (const p of ["device:write", "measurement:upload", "measurement:approve", "sheet:write", "sheet:review", "user:manage"] as const) {
      expect(can("customer", p)).toBe(false);
    }
    expect(roles).toHaveLength(4);
  });

  it("keeps uploading and approving measurements with different roles (four eyes)", () => {
    for (const role of roles) expect(can(role, "measurement:upload") && can(role, "measurement:approve")).toBe(false);
  });
});
