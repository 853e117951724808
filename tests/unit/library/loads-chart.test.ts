import fs from "node:fs";
import path from "node:path";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { LoadsChart } from "@/components/loads/loads-chart";
import { parseProjectFile } from "@/lib/compliance";
import type { ProjectRecord } from "@/lib/schemas/project-record";

function example(name: string): ProjectRecord {
  const parsed = parseProjectFile(JSON.parse(fs.readFileSync(path.join(__dirname, `../../../examples/${name}.json`), "utf8")));
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return parsed.record;
}

const text = (html: string) => html.replace(/<[^>]+>/g, " ").replace(/&#x27;/g, "'").replace(/\s+/g, " ");

describe("loads and autonomy figures", () => {
  it("gives every figure of the hut in the tables beside the charts", () => {
    // Hand sum of examples/tamarack-hut.json: AC loads 240 + 250 + 360 + 150 + 90 = 1,090 Wh, drawn through the
    // inverter at 92 % efficiency: 1,090 ÷ 0.92 = 1,184.8 Wh (95 Wh of conversion loss); idle 20 W × 24 h = 480 Wh.
    // Daily need 1,184.8 + 480 = 1,664.8 Wh.
    const out = text(renderToStaticMarkup(createElement(LoadsChart, { record: example("tamarack-hut") })));
    expect(out).toContain("Inverter idle, 24 h INV-1: 20 W × 24 h 480");
    expect(out).toContain("loads ÷ 92 % efficiency 95");
    expect(out).toContain("Daily need 1,665 Wh");
    // 1,664.8 Wh × 2.5 days designed for = 4,162 Wh; battery 5.12 kWh × 90 % = 4.608 kWh usable.
    expect(out).toContain("Needed: daily need × days 4.16 kWh");
    expect(out).toContain("Σ kWh × qty × depth of discharge 4.61 kWh");
    // 4.608 kWh ÷ 1.6648 kWh a day = 2.77 days.
    expect(out).toContain("Days the storage carries 2.8 d");
    expect(out).toContain("Covers the target");
  });

  it("says when storage cannot be worked out and when there are no loads", () => {
    const record = example("tamarack-hut");
    const noDod = { ...record, loads: [], equipment: record.equipment.map((e) => (e.kind === "battery" ? { ...e, usableDodPct: undefined } : e)) };
    const out = text(renderToStaticMarkup(createElement(LoadsChart, { record: noDod as ProjectRecord })));
    expect(out).toContain("No loads recorded yet");
    expect(out).toContain("Usable storage needs each battery's energy");
  });

  it("marks a stand-alone shortfall and treats a grid-interactive one as backup", () => {
    const hut = example("tamarack-hut");
    const short = text(renderToStaticMarkup(createElement(LoadsChart, { record: { ...hut, daysOfAutonomy: 5 } })));
    // 1,664.8 Wh × 5 d = 8.324 kWh against 4.608 kWh usable: short by 3.72 kWh.
    expect(short).toContain("Short of the target by 3.72 kWh");
    const farm = text(renderToStaticMarkup(createElement(LoadsChart, { record: example("ferncliff-farmhouse") })));
    expect(farm).toContain("Grid-interactive: the grid carries the days without sun");
    expect(farm).not.toContain("Short of the target");
  });
});
