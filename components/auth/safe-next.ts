/** Only a same-site path may be a post-sign-in destination (no "//host" or absolute URLs). */
export function safeNextPath(next: string | string[] | undefined): string | null {
  const value = Array.isArray(next) ? next[0] : next;
  if (!value || !value.startsWith("/") || value.startsWith("//") || value.startsWith("/\\")) return null;
  return value;
}
