/**
 * Moves focus to the control that edits a record path ("circuits.2.lengthFt")
 * and marks every control of the given paths for a moment. Controls carry
 * their record path as `name`. Paths inside an equipment item's ratings need
 * the item opened first; the editor listens for that event.
 */
export const OPEN_EQUIPMENT_EVENT = "sundocket:open-equipment";
/** Asks a grid to open a row's detail; the grid listens (editable-grid re-exports it). */
export const OPEN_ROW_EVENT = "sundocket:open-row";
/** Tailwind classes written out in full so the stylesheet keeps them. */
const HIGHLIGHT_CLASSES = ["ring-2", "ring-query", "ring-offset-1", "bg-query-soft"];
const HIGHLIGHT_MS = 2500;

function find(path: string): HTMLElement | null {
  let p = path;
  while (p) {
    const exact = document.querySelector<HTMLElement>(`[name="${CSS.escape(p)}"]`);
    if (exact) return exact;
    const inside = document.querySelector<HTMLElement>(`[name^="${CSS.escape(p + ".")}"]`);
    if (inside) return inside;
    const cut = p.lastIndexOf(".");
    if (cut < 0) break;
    p = p.slice(0, cut);
  }
  return null;
}

function highlight(paths: string[]) {
  for (const path of paths) {
    const el = document.querySelector<HTMLElement>(`[name="${CSS.escape(path)}"]`);
    if (!el) continue;
    el.classList.add(...HIGHLIGHT_CLASSES);
    setTimeout(() => el.classList.remove(...HIGHLIGHT_CLASSES), HIGHLIGHT_MS);
  }
}

export function focusRecordPaths(paths: string[]): boolean {
  const first = paths[0];
  if (!first) return false;
  const equipment = /^equipment\.(\d+)\./.exec(first);
  const direct = document.querySelector<HTMLElement>(`[name="${CSS.escape(first)}"]`);
  const detail = /^(circuits)\.(\d+)\./.exec(first);
  if (!direct && detail) {
    window.dispatchEvent(new CustomEvent(OPEN_ROW_EVENT, { detail: { grid: detail[1], index: Number(detail[2]) } }));
    setTimeout(() => focusNow(paths), 60);
    return true;
  }
  if (!direct && equipment) {
    window.dispatchEvent(new CustomEvent(OPEN_EQUIPMENT_EVENT, { detail: Number(equipment[1]) }));
    // The ratings panel draws on the next frame.
    setTimeout(() => focusNow(paths), 60);
    return true;
  }
  return focusNow(paths);
}

function focusNow(paths: string[]): boolean {
  const el = find(paths[0] ?? "");
  if (!el) return false;
  el.scrollIntoView({ block: "center", behavior: "smooth" });
  el.focus({ preventScroll: true });
  highlight(paths);
  return true;
}
