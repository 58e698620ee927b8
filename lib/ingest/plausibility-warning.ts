/** Every plausibility warning starts with this, so the sheet can list them among its open issues (no other imports: lib/sheet reads it). */
export const PLAUSIBILITY_PREFIX = "Plausibility: ";

export function isPlausibilityWarning(warning: string): boolean {
  return warning.startsWith(PLAUSIBILITY_PREFIX);
}
