import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { afterEach, describe, expect, it, vi } from "vitest";
import { deviceClasses, deviceClassLabels, isDeviceClass } from "@/lib/domain/device-classes";
import { deviceBodySchema } from "@/lib/schemas/measurements";
import { findSheetTemplate } from "@/templates";

const testOnlyClass = "comb-generator-test-only";
const switchName = "BENCHFOLD_TEST_DEVICE_CLASSES";
const body = { partNumber: "CMB-1", deviceClass: testOnlyClass, title: "Comb generator" };

/** The list module, the schema and the registry as a build made with the test switch sees them. */
async function loadWithTestClasses() {
  vi.resetModules();
  vi.stubEnv(switchName, "1");
  const [classes, schemas, templates] = await Promise.all([
    import("@/lib/domain/device-classes"),
    import("@/lib/schemas/measurements"),
    import("@/templates"),
  ]);
  return { ...classes, ...schemas, ...templates };
}

afterEach(() => {
  vi.unstubAllEnvs();
  vi.resetModules();
});

describe("the device-class list", () => {
  it("has a template for each class, filed under the class's own name, and a label", () => {
    for (const deviceClass of deviceClasses) {
      expect(findSheetTemplate(deviceClass)?.deviceClass).toBe(deviceClass);
      expect(deviceClassLabels[deviceClass]).toMatch(/^[A-Z]/);
    }
  });

  it("offers the shipped classes and no test-only one in a normal build", () => {
    expect(process.env[switchName]).toBeUndefined();
    expect(deviceClasses).toEqual(["frequency-multiplier", "double-balanced-mixer", "quadrature-hybrid"]);
    expect(isDeviceClass(testOnlyClass)).toBe(false);
    expect(findSheetTemplate(testOnlyClass)).toBeUndefined();
    const parsed = deviceBodySchema.safeParse(body);
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues[0]).toMatchObject({ path: ["deviceClass"], message: "Choose one of the device classes." });
  });

  it("offers the test-only class when the build sets the switch, through the same list, schema and registry", async () => {
    const built = await loadWithTestClasses();
    expect(built.deviceClasses).toEqual(["frequency-multiplier", "double-balanced-mixer", "quadrature-hybrid", testOnlyClass]);
    expect(built.deviceBodySchema.safeParse(body).success).toBe(true);
    expect(built.findSheetTemplate(testOnlyClass)?.deviceClass).toBe(testOnlyClass);
  });

  it("is switched on by the test script's build only", () => {
    const root = path.resolve(__dirname, "../../..");
    const scripts = readdirSync(path.join(root, "scripts"), { withFileTypes: true }).filter((e) => e.isFile());
    const candidates = ["package.json", "next.config.mjs", ...scripts.map((e) => `scripts/${e.name}`)];
    const setters = candidates.filter((file) => readFileSync(path.join(root, file), "utf8").includes(`${switchName}=1`));
    expect(setters).toEqual(["scripts/test.sh"]);
  });
});
