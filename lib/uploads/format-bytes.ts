/** Sizes as people read them on a file list: binary multiples, one decimal above 1 KB. */
export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  const units = ["KB", "MB", "GB"];
  let value = bytes / 1024;
  let unit = 0;
  while (value >= 1024 && unit < units.length - 1) {
    value /= 1024;
    unit++;
  }
  const shown = value >= 100 || Number.isInteger(value) ? value.toFixed(0) : value.toFixed(1);
  return `${shown} ${units[unit]}`;
}
