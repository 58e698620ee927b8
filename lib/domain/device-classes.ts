/**
 * The device classes Benchfold makes sheets for: the one list that the device model, the
 * device schema, the template registry (templates/index.ts), the labels and the device list's
 * sort derive from. A new class is a folder in templates/ plus one line here (DEVELOPERS.md,
 * "Adding a device class"). The database stores the name as text: a new class needs no migration.
 *
 * Pure data: server code and client components both import it.
 */
const deviceClassList = [
  { id: "frequency-multiplier", label: "Frequency multiplier" },
  { id: "double-balanced-mixer", label: "Double-balanced mixer" },
  { id: "quadrature-hybrid", label: "Quadrature hybrid or power splitter" },
  // Added by the recipe to prove it end to end (tests/integration/new-device-class.test.ts); present only
  // in a build made with BENCHFOLD_TEST_DEVICE_CLASSES=1, as `npm test` makes its build.
  { id: "comb-generator-test-only", label: "Comb generator", testOnly: true },
] as const satisfies readonly { id: string; label: string; testOnly?: true }[];

/** Every class name the code knows, test-only ones included (the type of a template's key). */
export type DeviceClass = (typeof deviceClassList)[number]["id"];

/**
 * Fixed at build time for the app: next.config.mjs writes the variable's value (empty unless
 * set) into the server and the browser bundles alike, so a normal build never offers a
 * test-only class, whatever the environment of the running server says.
 */
export const testOnlyDeviceClassesEnabled = process.env.BENCHFOLD_TEST_DEVICE_CLASSES === "1";

/** The classes a device may have, in the order forms offer them. */
export const deviceClasses: readonly DeviceClass[] = deviceClassList
  .filter((c) => !("testOnly" in c) || testOnlyDeviceClassesEnabled)
  .map((c) => c.id);

/** Human names of the classes: tables, forms, the device list's sort and the sheet's class line. */
export const deviceClassLabels = Object.fromEntries(deviceClassList.map((c) => [c.id, c.label])) as Record<DeviceClass, string>;

export function isDeviceClass(value: unknown): value is DeviceClass {
  return typeof value === "string" && (deviceClasses as readonly string[]).includes(value);
}
