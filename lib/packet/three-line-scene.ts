/**
 * Three-line detail of a 120 V-only inverter feeding a 120/240 V panel: the
 * line conductor to L1, the L1–L2 jumper, the neutral and the EGC, and the
 * neutral-to-ground bond where the record puts it. Drawn as primitives
 * measured in points from the detail's top-left corner, so the PDF sheet and
 * the DOCX picture draw the same thing. Caption carries
 * "inverter|panel|circuit|bondTag".
 */
export type ThreeLinePrim =
  | { type: "line"; x1: number; y1: number; x2: number; y2: number; width: number }
  | { type: "box"; x: number; y: number; w: number; h: number; border: number; fill: boolean }
  /** y is the baseline. */
  | { type: "text"; x: number; y: number; text: string; bold: boolean; size: number };

export const THREE_LINE_HEIGHT = 250;
/** The note's size: the smallest lettering on a sheet. */
const NOTE_PT = 8;
const FRAME_PT = 0.5;

export function threeLineScene(caption: string, w: number): { h: number; prims: ThreeLinePrim[] } {
  const [inverter = "", panel = "", circuit = "", bondTag = ""] = caption.split("|");
  const h = THREE_LINE_HEIGHT;
  const prims: ThreeLinePrim[] = [];
  const text = (t: string, x: number, y: number, bold = false, size = 9) => prims.push({ type: "text", x, y, text: t, bold, size });
  const line = (x1: number, y1: number, x2: number, y2: number, width = 1.2) => prims.push({ type: "line", x1, y1, x2, y2, width });
  const box = (x: number, y: number, bw: number, bh: number) => prims.push({ type: "box", x, y, w: bw, h: bh, border: 1, fill: true });
  const inv = { x: 20, y: 30, w: 170, h: 170 };
  const pnl = { x: Math.min(w - 260, 560), y: 20, w: 240, h: 200 };
  box(inv.x, inv.y, inv.w, inv.h);
  box(pnl.x, pnl.y, pnl.w, pnl.h);
  text(inverter, inv.x + 8, inv.y + 16, true, 10);
  text("120 V AC output", inv.x + 8, inv.y + 30);
  text(panel, pnl.x + 8, pnl.y + 16, true, 10);
  text("120/240 V panel", pnl.x + 8, pnl.y + 30);
  // Terminal rows, top to bottom: line, neutral, ground.
  const rows = { L: 100, N: 145, G: 180 };
  const termX = inv.x + inv.w;
  const barX = pnl.x + 40;
  text("L", termX - 14, rows.L + 3, true);
  text("N", termX - 14, rows.N + 3, true);
  text("G", termX - 14, rows.G + 3, true);
  // Panel bus: L1 and L2 as vertical bars, N and G bars below.
  const l1 = barX;
  const l2 = barX + 70;
  line(l1, rows.L - 22, l1, rows.L + 18, 3);
  line(l2, rows.L - 22, l2, rows.L + 18, 3);
  text("L1", l1 - 6, rows.L - 26, true);
  text("L2", l2 - 6, rows.L - 26, true);
  line(barX - 10, rows.N, barX + 120, rows.N, 3);
  text("N BAR", barX + 126, rows.N + 3, true);
  line(barX - 10, rows.G, barX + 120, rows.G, 3);
  text("G BAR", barX + 126, rows.G + 3, true);
  // Conductors from the inverter.
  line(termX, rows.L, l1, rows.L);
  line(termX, rows.N, barX - 10, rows.N);
  line(termX, rows.G, barX - 10, rows.G, 0.9);
  text(`${circuit}: line`, termX + 12, rows.L - 4);
  text(`${circuit}: neutral`, termX + 12, rows.N - 4);
  text(`${circuit}: EGC`, termX + 12, rows.G - 4);
  // The jumper that puts both legs on the one 120 V line.
  line(l1, rows.L + 12, l2, rows.L + 12, 2.4);
  text("L1–L2 JUMPER", l1 + 4, rows.L + 29, true);
  // Neutral-to-ground bond where the record puts it.
  const bondX = bondTag === panel ? barX + 100 : bondTag === inverter ? termX - 30 : null;
  if (bondX !== null) {
    line(bondX, rows.N, bondX, rows.G, 2.4);
    text("N–G BOND", bondX + 4, (rows.N + rows.G) / 2 + 3, true);
  } else {
    text(bondTag ? `N–G bond at ${bondTag}` : "N–G bond location not given", pnl.x + 8, pnl.y + pnl.h - 8, true);
  }
  prims.push({ type: "box", x: 0, y: 0, w, h, border: FRAME_PT, fill: false });
  text("Not to scale. One neutral-to-ground bond in the system.", 8, h - 8, false, NOTE_PT);
  return { h, prims };
}
