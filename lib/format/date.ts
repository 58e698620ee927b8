/** ISO 8601 dates, as on a datasheet's revision block; UTC so server and browser agree. */
export function formatDate(iso: string): string {
  return new Date(iso).toISOString().slice(0, 10);
}

export function formatDateTime(iso: string): string {
  const d = new Date(iso).toISOString();
  return `${d.slice(0, 10)} ${d.slice(11, 16)} UTC`;
}
