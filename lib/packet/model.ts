import type { CheckResult, CheckStatus } from "../compliance/types";
import { EQUIPMENT_KIND_LABELS, type Circuit, type Equipment, type ProjectRecord } from "../schemas/project-record";
import { DATASHEET_KINDS as DATASHEET_KIND_LIST, missingDocuments as missingOnFileDocuments } from "../compliance/documents";
import { dash, formatNumber, isoDate } from "./format";
import type { Block, Cell, TableColumn } from "./markup";
import { renderSheetTemplate, type TemplateContext } from "./templates";
import type { PacketInput, SheetTemplateName } from "./types";

export type SheetKind =
  | "cover"
  | "general-notes"
  | "site-plan"
  | "one-line"
  | "energy-storage"
  | "calculations"
  | "conductor-schedule"
  | "equipment-schedule"
  | "label-schedule"
  | "review-record";

export interface Sheet {
  code: string;
  title: string;
  kind: SheetKind;
  /** Text columns on a 17 in sheet; tables and figures span them all. */
  columns: 1 | 2 | 3;
  blocks: Block[];
}

export interface PacketDatasheet {
  code: string;
  title: string;
  equipmentTag?: string;
  bytes: Uint8Array;
}

export interface PacketMarking {
  approved: boolean;
  /** Printed on every page of an unapproved revision. */
  reviewText: string;
  /** Printed on every page of an approved revision. */
  approvalLines: string[];
  footer: string;
}

export interface PacketModel {
  titleBlock: {
    firm: string;
    preparedBy: string;
    project: string;
    client: string;
    address: string;
    jurisdiction: string;
    edition: string;
    revision: string;
    date: string;
  };
  sheets: Sheet[];
  datasheets: PacketDatasheet[];
  marking: PacketMarking;
  draft: { isDraft: boolean; reasons: string[] };
  missingDocuments: string[];
}

export const REVIEW_MARKING = "PREPARED FOR REVIEW BY A LICENSED PROFESSIONAL — NOT FOR CONSTRUCTION UNTIL STAMPED";
export const AHJ_FOOTER = "Local codes and the Authority Having Jurisdiction govern.";

/** Sheet list in packet order: the index, the page headers and both writers read it. */
export const SHEET_PLAN: { code: string; title: string; kind: SheetKind; template: SheetTemplateName; columns: 1 | 2 | 3 }[] = [
  { code: "G-001", title: "Cover sheet and sheet index", kind: "cover", template: "cover", columns: 2 },
  { code: "G-002", title: "General notes and cautions", kind: "general-notes", template: "general-notes", columns: 3 },
  { code: "G-003", title: "Site plan and equipment locations", kind: "site-plan", template: "site-plan", columns: 1 },
  { code: "E-001", title: "One-line diagram", kind: "one-line", template: "one-line", columns: 1 },
  { code: "E-002", title: "Energy storage", kind: "energy-storage", template: "energy-storage", columns: 1 },
  { code: "E-003", title: "Calculations", kind: "calculations", template: "calculations", columns: 3 },
  { code: "E-004", title: "Conductor and overcurrent schedule", kind: "conductor-schedule", template: "schedules", columns: 1 },
  { code: "E-005", title: "Equipment schedule", kind: "equipment-schedule", template: "schedules", columns: 1 },
  { code: "E-006", title: "Label schedule", kind: "label-schedule", template: "label-schedule", columns: 1 },
  { code: "G-004", title: "Review record", kind: "review-record", template: "review-record", columns: 2 },
];

const SYSTEM_KIND_LABEL: Record<ProjectRecord["systemKind"], string> = {
  "stand-alone": "Stand-alone PV and battery system",
  "stand-alone-generator": "Stand-alone PV and battery system with generator",
  hybrid: "Hybrid (grid-interactive) PV and battery system",
};

const OCCUPANCY_LABEL: Record<ProjectRecord["site"]["occupancy"], string> = {
  "one-two-family-dwelling": "One- and two-family dwelling",
  "other-building": "Other building",
};

const LOCATION_LABEL: Record<string, string> = {
  "utility-closet": "utility closet",
  basement: "basement",
  "storage-room": "storage room",
  garage: "garage",
  "accessory-building": "accessory building",
  "exterior-wall": "exterior wall",
  outdoors: "outdoors",
  "habitable-room": "habitable room",
};

// A schedule spells out the two kinds that read ambiguously on a permit sheet.
const KIND_LABEL: Record<Equipment["kind"], string> = {
  ...EQUIPMENT_KIND_LABELS,
  breaker: "Circuit breaker",
  "ac-panel": "AC distribution panel",
};

const CIRCUIT_KIND_LABEL: Record<Circuit["kind"], string> = {
  "pv-source": "PV source",
  "pv-output": "PV output",
  battery: "Battery",
  "inverter-dc-input": "Inverter DC input",
  "inverter-ac-output": "Inverter AC output",
  "generator-output": "Generator output",
  "ac-branch": "AC branch",
};

/** Equipment whose datasheet a permit office asks for (the submittal check's list). */
const DATASHEET_KINDS = new Set<string>(DATASHEET_KIND_LIST);

const STATUS_ORDER: CheckStatus[] = ["fail", "needs-input", "warning", "attest", "pass", "not-applicable"];

function worstStatus(results: CheckResult[]): CheckStatus | null {
  let worst: CheckStatus | null = null;
  for (const r of results) {
    if (worst === null || STATUS_ORDER.indexOf(r.status) < STATUS_ORDER.indexOf(worst)) worst = r.status;
  }
  return worst;
}

function equipmentByTag(record: ProjectRecord): Map<string, Equipment> {
  return new Map(record.equipment.map((e) => [e.tag, e]));
}

function describe(e: Equipment | undefined): string {
  if (!e) return "";
  return [e.manufacturer, e.model].filter(Boolean).join(" ");
}

function batteryKWh(e: Extract<Equipment, { kind: "battery" }>): number | undefined {
  if (e.capacityKWh !== undefined) return e.capacityKWh;
  if (e.capacityAh !== undefined && e.nominalVoltageV !== undefined) return (e.capacityAh * e.nominalVoltageV) / 1000;
  return undefined;
}

function keyRatings(e: Equipment): string {
  switch (e.kind) {
    case "pv-module":
      return [dash(e.pmaxW, "W"), `Voc ${dash(e.vocV, "V")}`, `Isc ${dash(e.iscA, "A")}`, `Vmp ${dash(e.vmpV, "V")}`, `Imp ${dash(e.impA, "A")}`, `max system ${dash(e.maxSystemVoltageV, "V")}`].join(", ");
    case "charge-controller":
      return [e.controllerType?.toUpperCase() ?? "type —", `PV in max ${dash(e.maxPvInputVoltageV, "V")} / ${dash(e.maxPvInputCurrentA, "A")}`, `output ${dash(e.ratedOutputCurrentA, "A")}`, `battery ${e.batteryVoltagesV.length ? e.batteryVoltagesV.join("/") + " V" : "—"}`].join(", ");
    case "inverter":
    case "inverter-charger":
    case "hybrid-inverter":
      return [`${dash(e.continuousW, "W")} continuous`, `${dash(e.surgeW, "W")} surge`, `battery ${dash(e.nominalBatteryVoltageV, "V")}`, `AC ${e.acOutput ?? dash(e.acOutputVoltageV, "V")} ${e.acOutputPhases}φ`, `listed ${e.listedMode ?? "—"}`].join(", ");
    case "battery":
      return [e.chemistry?.toUpperCase() ?? "chemistry —", dash(e.nominalVoltageV, "V"), dash(e.capacityAh, "Ah"), dash(batteryKWh(e) !== undefined ? formatNumber(batteryKWh(e)!) : undefined, "kWh"), `max discharge ${dash(e.maxContinuousDischargeA, "A")}`, `short-circuit ${dash(e.shortCircuitCurrentA, "A")}`].join(", ");
    case "generator":
      return [dash(e.ratedKW, "kW"), e.output ?? dash(e.voltageV, "V"), e.fuel ?? "fuel —"].join(", ");
    case "disconnect":
    case "fuse":
    case "breaker":
      return [dash(e.ratingA, "A"), dash(e.voltageRatingV, "V"), e.currentType?.toUpperCase() ?? "AC/DC —", `AIC ${dash(e.interruptingRatingA, "A")}`].join(", ");
    case "rapid-shutdown":
      return [e.method ?? "method —", e.controls].filter(Boolean).join(", ");
    case "ac-panel":
    case "busbar":
      return [`bus ${dash(e.busRatingA, "A")}`, `main ${dash(e.mainBreakerA, "A")}`, e.voltage ? `${e.voltage} V` : "voltage —"].join(", ");
  }
}

function systemFigures(record: ProjectRecord) {
  const eq = equipmentByTag(record);
  let moduleCount = 0;
  let arrayW = 0;
  for (const a of record.arrays) {
    const n = a.modulesInSeries * a.stringsInParallel;
    moduleCount += n;
    const m = eq.get(a.moduleTag);
    if (m?.kind === "pv-module" && m.pmaxW !== undefined) arrayW += n * m.pmaxW;
  }
  let storageKWh = 0;
  let batteryUnits = 0;
  let inverterW = 0;
  for (const e of record.equipment) {
    if (e.kind === "battery") {
      batteryUnits += e.quantity;
      storageKWh += (batteryKWh(e) ?? 0) * e.quantity;
    }
    if ((e.kind === "inverter" || e.kind === "inverter-charger" || e.kind === "hybrid-inverter") && e.continuousW) {
      inverterW += e.continuousW * e.quantity;
    }
  }
  return { moduleCount, arrayKwDc: arrayW / 1000, storageKWh, batteryUnits, inverterW };
}

function scopeLines(record: ProjectRecord): string[] {
  const eq = equipmentByTag(record);
  const lines: string[] = [
    `${SYSTEM_KIND_LABEL[record.systemKind]} for ${record.site.occupancy === "one-two-family-dwelling" ? "a one- and two-family dwelling" : "a building other than a one- and two-family dwelling"}, ${record.site.mounting}-mounted array.`,
  ];
  for (const a of record.arrays) {
    const m = eq.get(a.moduleTag);
    const n = a.modulesInSeries * a.stringsInParallel;
    const kw = m?.kind === "pv-module" && m.pmaxW ? ` (${formatNumber((n * m.pmaxW) / 1000)} kW DC)` : "";
    lines.push(
      `PV array ${a.tag}: ${n} × ${describe(m) || a.moduleTag}, ${a.modulesInSeries} in series × ${a.stringsInParallel} string${a.stringsInParallel === 1 ? "" : "s"}${kw}, feeding ${a.feedsTag}${a.mpptInputId ? ` input ${a.mpptInputId}` : ""}.`,
    );
  }
  for (const e of record.equipment) {
    if (e.kind === "battery") {
      const kwh = batteryKWh(e);
      lines.push(
        `Energy storage ${e.tag}: ${e.quantity} × ${describe(e) || "battery"}${e.chemistry ? ` (${e.chemistry.toUpperCase()})` : ""}${kwh !== undefined ? `, ${formatNumber(kwh * e.quantity)} kWh total` : ""}${record.site.batteryLocation ? `, in the ${LOCATION_LABEL[record.site.batteryLocation]}` : ""}.`,
      );
    } else if (e.kind === "inverter" || e.kind === "inverter-charger" || e.kind === "hybrid-inverter") {
      lines.push(`${KIND_LABEL[e.kind]} ${e.tag}: ${describe(e) || e.kind}, ${dash(e.continuousW, "W")} continuous, ${e.acOutput ?? dash(e.acOutputVoltageV)} V AC output.`);
    } else if (e.kind === "charge-controller") {
      lines.push(`Charge controller ${e.tag}: ${describe(e) || "controller"}${e.controllerType ? ` (${e.controllerType.toUpperCase()})` : ""}.`);
    } else if (e.kind === "generator") {
      lines.push(`Generator ${e.tag}: ${describe(e) || "generator"}, ${dash(e.ratedKW, "kW")}${e.fuel ? `, ${e.fuel}` : ""}.`);
    }
  }
  return lines;
}

/** Documents the jurisdiction asks for that the packet lacks, each named. */
/**
 * The documents the jurisdiction requires that the packet does not carry, in
 * the submittal check's words: the record's attachment list plus what this
 * packet was handed to merge.
 */
export function missingDocuments(input: PacketInput): string[] {
  const { record } = input;
  const onFile = [
    ...record.attachments,
    ...input.datasheets.map((d) => ({ kind: /listing/i.test(d.title) ? "storage-listing" : "datasheet", equipmentTag: d.equipmentTag })),
    ...(input.sitePlan ? [{ kind: "site-plan" }] : []),
  ];
  return missingOnFileDocuments(record, onFile, record.jurisdiction.requiredDocuments);
}

function draftReasons(input: PacketInput, missingDocs: string[]): string[] {
  const reasons: string[] = [];
  const { counts, results } = input.run;
  if (counts.fail > 0) reasons.push(`${counts.fail} check${counts.fail === 1 ? "" : "s"} fail`);
  if (counts["needs-input"] > 0) reasons.push(`${counts["needs-input"]} check${counts["needs-input"] === 1 ? " needs" : "s need"} input`);
  const labelGaps = results.filter((r) => r.checkId.includes("label") && (r.status === "fail" || r.status === "needs-input"));
  for (const r of labelGaps) reasons.push(`required label missing or incomplete: ${r.subject ?? r.title}`);
  for (const l of input.labels) {
    if (l.lines.length === 0) reasons.push(`required label ${l.id} has no wording`);
    else if (l.missing?.length) reasons.push(`label ${l.id} incomplete: ${l.missing.join(", ")} missing`);
  }
  reasons.push(...missingDocs);
  return reasons;
}

export function templateContext(input: PacketInput, sheet: { code: string; title: string; kind: string }, sheetPages: Map<string, string>, datasheets: PacketDatasheet[], draft: { isDraft: boolean; reasons: string[] }): TemplateContext {
  const { record, run, revision, approval } = input;
  const fig = systemFigures(record);
  const hasBattery = record.equipment.some((e) => e.kind === "battery");
  const codes: { name: string; edition: string }[] = [{ name: "NFPA 70, National Electrical Code", edition: run.edition }];
  if (record.jurisdiction.residentialCode !== "none") {
    codes.push({ name: "International Residential Code", edition: record.jurisdiction.residentialCode.replace("IRC-", "") });
  }
  if (hasBattery) codes.push({ name: "NFPA 855, Installation of Stationary Energy Storage Systems", edition: "as adopted by the AHJ" });
  codes.push({ name: "ANSI Z535.4, Product Safety Signs and Labels (label format)", edition: "current" });
  return {
    firm: { name: revision.organisation, preparedBy: revision.preparedBy },
    project: {
      name: record.name,
      client: record.client,
      address: record.site.address,
      systemKind: record.systemKind,
      systemKindLabel: SYSTEM_KIND_LABEL[record.systemKind],
      occupancy: record.site.occupancy,
      occupancyLabel: OCCUPANCY_LABEL[record.site.occupancy],
      mounting: record.site.mounting,
      batteryLocation: record.site.batteryLocation ? LOCATION_LABEL[record.site.batteryLocation] ?? "" : "",
      batteryLocationNote: record.site.batteryLocationNote,
    },
    jurisdiction: {
      name: record.jurisdiction.name,
      necEdition: run.edition,
      residentialCode: record.jurisdiction.residentialCode,
      voltageDropLimitPct: formatNumber(record.jurisdiction.voltageDropLimitPct ?? 3),
      requiredDocuments: record.jurisdiction.requiredDocuments,
    },
    revision: { number: String(revision.number), date: isoDate(revision.createdAt), createdAt: revision.createdAt },
    sheet: { code: sheet.code, title: sheet.title, kind: sheet.kind },
    sheets: [
      ...SHEET_PLAN.map((s) => ({ code: s.code, title: s.title, pages: sheetPages.get(s.code) ?? "" })),
      ...datasheets.map((d) => ({ code: d.code, title: d.title, pages: sheetPages.get(d.code) ?? "" })),
    ],
    scope: scopeLines(record),
    codes,
    system: {
      moduleCount: String(fig.moduleCount),
      arrayKwDc: formatNumber(fig.arrayKwDc),
      storageKWh: formatNumber(fig.storageKWh),
      inverterW: formatNumber(fig.inverterW),
      batteryUnits: String(fig.batteryUnits),
    },
    site: {
      designLowTempC: dash(record.site.designLowTempC),
      designLowTempSource: record.site.designLowTempSource || "source not given",
      designHighTempC: dash(record.site.designHighTempC),
      designHighTempSource: record.site.designHighTempSource || "source not given",
      sunHoursPerDay: dash(record.site.sunHoursPerDay),
    },
    counts: {
      total: String(run.results.length),
      pass: String(run.counts.pass),
      fail: String(run.counts.fail),
      warning: String(run.counts.warning),
      needsInput: String(run.counts["needs-input"]),
      attest: String(run.counts.attest),
      notApplicable: String(run.counts["not-applicable"]),
    },
    draft,
    flags: {
      hasPv: record.arrays.length > 0,
      hasBattery,
      hasGenerator: record.equipment.some((e) => e.kind === "generator"),
      onBuilding: record.site.mounting === "roof",
      standAlone: record.systemKind !== "hybrid",
      hybrid: record.systemKind === "hybrid",
    },
    approved: Boolean(approval),
    approval: approval
      ? {
          reviewerName: approval.reviewerName,
          licenceNumber: approval.licenceNumber,
          licenceState: approval.licenceState,
          licenceDiscipline: approval.licenceDiscipline,
          approvedAt: isoDate(approval.approvedAt),
          recordSha256: approval.recordSha256,
        }
      : null,
    reviewNotes: (input.reviewNotes ?? []).map((n) => ({ target: n.target, text: n.text, author: n.author })),
    labels: {
      count: String(input.labels.length),
      list: input.labels.map((l) => ({
        id: l.id,
        title: l.title,
        signalWord: l.signalWord,
        codeRef: l.codeRef,
        location: l.location,
        equipmentTag: l.equipmentTag ?? "",
      })),
    },
    attachments: {
      sitePlan: input.sitePlan?.fileName ?? "",
      datasheets: datasheets.map((d) => ({ code: d.code, title: d.title, equipmentTag: d.equipmentTag ?? "" })),
    },
  };
}

function table(columns: [string, number, ("left" | "right" | "center")?][], rows: Cell[][], caption?: string): Block {
  const cols: TableColumn[] = columns.map(([header, weight, align]) => ({ header, weight, align: align ?? "left" }));
  return { kind: "table", columns: cols, rows, caption };
}

function resultsFor(run: PacketInput["run"], subject: string): CheckResult[] {
  return run.results.filter((r) => r.subject === subject);
}

function statusCell(results: CheckResult[]): Cell {
  const worst = worstStatus(results);
  return worst ? { text: "", status: worst } : "—";
}

/** A figure from the first result of the check that carries one of the keys, in key order of preference. */
function findValue(results: CheckResult[], checkId: string, keys: string[]): string {
  for (const key of keys) {
    for (const r of results) {
      if (r.checkId !== checkId) continue;
      const v = r.values.find((x) => x.key === key);
      if (v && typeof v.value === "number") return `${formatNumber(v.value)}${v.unit ? " " + v.unit : ""}`;
    }
  }
  return "—";
}

function sitePlanBlocks(input: PacketInput): Block[] {
  const { record } = input;
  const rows: Cell[][] = record.equipment.map((e) => {
    let where = "As shown on the plan";
    if (e.kind === "battery") {
      where = [record.site.batteryLocation ? LOCATION_LABEL[record.site.batteryLocation] : "location not given", record.site.batteryLocationNote]
        .filter(Boolean)
        .join(" — ");
    } else if (e.kind === "pv-module") {
      where = `${record.site.mounting === "roof" ? "Roof" : "Ground"}-mounted array`;
    }
    return [e.tag, KIND_LABEL[e.kind], describe(e) || "—", String(e.quantity), where];
  });
  for (const a of record.arrays) {
    rows.push([a.tag, "PV array", `${a.modulesInSeries} × ${a.stringsInParallel} of ${a.moduleTag}`, String(a.modulesInSeries * a.stringsInParallel), `${record.site.mounting === "roof" ? "Roof" : "Ground"} mount, feeds ${a.feedsTag}`]);
  }
  return [
    { kind: "figure", figure: "site-plan", caption: input.sitePlan ? `Site plan: ${input.sitePlan.fileName}` : "Site plan not attached" },
    table([["Tag", 1], ["Equipment", 2], ["Make and model", 3], ["Qty", 0.6, "right"], ["Location", 5]], rows, "Equipment and battery locations"),
  ];
}

function storageBlocks(input: PacketInput): Block[] {
  const { record, run } = input;
  const batteries = record.equipment.filter((e): e is Extract<Equipment, { kind: "battery" }> => e.kind === "battery");
  const rows: Cell[][] = batteries.map((b) => {
    const kwh = batteryKWh(b);
    return [
      b.tag,
      describe(b) || "—",
      b.chemistry?.toUpperCase() ?? "—",
      String(b.quantity),
      dash(b.nominalVoltageV, "V"),
      dash(b.capacityAh, "Ah"),
      kwh !== undefined ? `${formatNumber(kwh)} kWh` : "—",
      kwh !== undefined ? `${formatNumber(kwh * b.quantity)} kWh` : "—",
      b.listing || "—",
      b.largeScaleFireTested ? "yes" : "no",
    ];
  });
  const s = record.site;
  const storageChecks = run.results.filter((r) => /storage|siting|battery/.test(r.checkId));
  const blocks: Block[] = [
    table(
      [["Tag", 0.8], ["Make and model", 2.4], ["Chemistry", 1], ["Units", 0.6, "right"], ["Nominal", 0.9, "right"], ["Capacity", 0.9, "right"], ["Energy / unit", 1, "right"], ["Energy total", 1, "right"], ["Listing", 1.8], ["Large-scale fire tested", 1.1]],
      rows.length ? rows : [["—", "No energy storage in this system", "", "", "", "", "", "", "", ""]],
      "Storage units",
    ),
    {
      kind: "fields",
      rows: [
        ["Location", s.batteryLocation ? LOCATION_LABEL[s.batteryLocation] ?? s.batteryLocation : "not given"],
        ["Location note", s.batteryLocationNote || "—"],
        ["Spacing between units", dash(s.batterySpacingIn, "in")],
        ["Smoke or heat detection", s.hasSmokeOrHeatDetection === undefined ? "not given" : s.hasSmokeOrHeatDetection ? "provided" : "not provided"],
        ["Vehicle-impact protection", s.hasVehicleImpactProtection === undefined ? "not given" : s.hasVehicleImpactProtection ? "provided" : "not provided"],
        ["Aggregate energy", `${formatNumber(batteries.reduce((t, b) => t + (batteryKWh(b) ?? 0) * b.quantity, 0))} kWh`],
      ],
    },
  ];
  if (storageChecks.length) {
    blocks.push({ kind: "heading", level: 2, text: "Storage checks" });
    blocks.push(...storageChecks.map((result): Block => ({ kind: "check", result })));
  }
  return blocks;
}

function conductorBlocks(input: PacketInput): Block[] {
  const { record, run } = input;
  const eq = equipmentByTag(record);
  const rows: Cell[][] = record.circuits.map((c) => {
    const ocpd = c.ocpdTag ? eq.get(c.ocpdTag) : undefined;
    const rating = ocpd && (ocpd.kind === "fuse" || ocpd.kind === "breaker" || ocpd.kind === "disconnect") ? dash(ocpd.ratingA, "A") : "—";
    const results = resultsFor(run, c.tag);
    return [
      { text: c.tag, bold: true },
      `${c.fromTag} → ${c.toTag}`,
      CIRCUIT_KIND_LABEL[c.kind],
      `${c.parallelSets > 1 ? `${c.parallelSets} × ` : ""}${c.size ? (Number(c.size) >= 250 ? `${c.size} kcmil` : `${c.size} AWG`) : "—"} ${c.material === "cu" ? "Cu" : "Al"}`,
      [c.insulation, c.insulationTempRatingC ? `${c.insulationTempRatingC} °C` : ""].filter(Boolean).join(" ") || "—",
      dash(c.currentCarryingConductors),
      [c.racewayType, c.racewaySize].filter(Boolean).join(" ") || "—",
      dash(c.lengthFt, "ft"),
      [c.ambientTempC !== undefined ? `${formatNumber(c.ambientTempC)} °C` : "site", c.onRooftop ? "rooftop" : ""].filter(Boolean).join(", "),
      c.terminalTempRatingC ? `${c.terminalTempRatingC} °C` : "—",
      c.arrayTag ? findValue(resultsFor(run, c.arrayTag), "max-pv-voltage", ["maxVoltageV"]) : "—",
      findValue(results, "circuit-current", ["currentA"]) === "—"
        ? findValue(results, "conductor-ampacity", ["currentA"])
        : findValue(results, "circuit-current", ["currentA"]),
      findValue(results, "conductor-ampacity", ["allowedA", "correctedA"]),
      c.ocpdTag ? `${c.ocpdTag} ${rating}` : "—",
      c.egcSize ? `${c.egcSize} AWG ${c.egcMaterial === "cu" ? "Cu" : "Al"}` : "—",
      statusCell(results),
    ];
  });
  const devices = record.equipment.filter(
    (e): e is Extract<Equipment, { kind: "disconnect" | "fuse" | "breaker" }> =>
      e.kind === "disconnect" || e.kind === "fuse" || e.kind === "breaker",
  );
  const deviceRows: Cell[][] = devices.map((d) => {
    const protectsOrOn = record.circuits.filter((c) => c.ocpdTag === d.tag || c.disconnectTags.includes(d.tag)).map((c) => c.tag);
    return [
      { text: d.tag, bold: true },
      KIND_LABEL[d.kind],
      describe(d) || "—",
      dash(d.ratingA, "A"),
      dash(d.voltageRatingV, "V"),
      d.currentType ? d.currentType.toUpperCase().replace("AC-DC", "AC/DC") : "—",
      dash(d.interruptingRatingA, "A"),
      dash(d.distanceFromBatteryFt, "ft"),
      protectsOrOn.join(", ") || "—",
      statusCell(resultsFor(run, d.tag)),
    ];
  });
  return [
    table(
      [["Circuit", 0.7], ["From → to", 1.5], ["Kind", 1.3], ["Conductor", 1.3], ["Insulation", 1.1], ["CCC", 0.5, "right"], ["Raceway", 1.2], ["Length", 0.7, "right"], ["Ambient", 0.9], ["Terminal", 0.7], ["Max voltage", 0.8, "right"], ["Current", 0.8, "right"], ["Ampacity", 0.8, "right"], ["OCPD", 1], ["EGC", 0.9], ["Checks", 1]],
      rows.length ? rows : [["—", "No circuits entered", "", "", "", "", "", "", "", "", "", "", "", "", "", ""]],
      "Conductor schedule",
    ),
    table(
      [["Tag", 0.7], ["Device", 1.2], ["Make and model", 2], ["Rating", 0.8, "right"], ["Voltage", 0.8, "right"], ["AC / DC", 0.7], ["Interrupting", 1, "right"], ["From battery", 0.9, "right"], ["Circuits", 1.4], ["Checks", 1]],
      deviceRows.length ? deviceRows : [["—", "No disconnects or overcurrent devices entered", "", "", "", "", "", "", "", ""]],
      "Overcurrent devices and disconnects",
    ),
  ];
}

function equipmentBlocks(input: PacketInput, datasheets: PacketDatasheet[]): Block[] {
  const { record, run } = input;
  const sheetFor = new Map<string, string>();
  for (const d of datasheets) if (d.equipmentTag && !sheetFor.has(d.equipmentTag)) sheetFor.set(d.equipmentTag, d.code);
  const rows: Cell[][] = record.equipment.map((e) => [
    { text: e.tag, bold: true },
    KIND_LABEL[e.kind],
    e.manufacturer || "—",
    e.model || "—",
    String(e.quantity),
    keyRatings(e),
    e.listing || "—",
    sheetFor.get(e.tag) ?? (DATASHEET_KINDS.has(e.kind) ? "MISSING" : "—"),
    statusCell(resultsFor(run, e.tag)),
  ]);
  const blocks: Block[] = [
    table(
      [["Tag", 0.7], ["Kind", 1.2], ["Manufacturer", 1.2], ["Model", 1.2], ["Qty", 0.4, "right"], ["Ratings", 5], ["Listing", 1.3], ["Datasheet", 0.8], ["Checks", 0.9]],
      rows.length ? rows : [["—", "No equipment entered", "", "", "", "", "", "", ""]],
      "Equipment",
    ),
  ];
  if (record.arrays.length) {
    const eq = equipmentByTag(record);
    blocks.push(
      table(
        [["Array", 0.7], ["Module", 1.6], ["In series", 0.8, "right"], ["Strings", 0.8, "right"], ["Modules", 0.8, "right"], ["DC rating", 1, "right"], ["Feeds", 1.2], ["Checks", 1]],
        record.arrays.map((a) => {
          const m = eq.get(a.moduleTag);
          const n = a.modulesInSeries * a.stringsInParallel;
          return [
            { text: a.tag, bold: true },
            `${a.moduleTag} ${describe(m)}`.trim(),
            String(a.modulesInSeries),
            String(a.stringsInParallel),
            String(n),
            m?.kind === "pv-module" && m.pmaxW ? `${formatNumber((n * m.pmaxW) / 1000)} kW` : "—",
            `${a.feedsTag}${a.mpptInputId ? ` / ${a.mpptInputId}` : ""}`,
            statusCell(resultsFor(run, a.tag)),
          ];
        }),
        "PV arrays",
      ),
    );
  }
  if (record.loads.length) {
    blocks.push(
      table(
        [["Load", 2], ["Watts", 0.8, "right"], ["Qty", 0.5, "right"], ["Hours / day", 0.8, "right"], ["Energy / day", 1, "right"], ["Surge", 0.8, "right"], ["Voltage", 0.7, "right"], ["Simultaneous", 0.9]],
        record.loads.map((l) => [
          l.name,
          `${formatNumber(l.watts)} W`,
          String(l.quantity),
          `${formatNumber(l.hoursPerDay)} h`,
          `${formatNumber(l.watts * l.quantity * l.hoursPerDay)} Wh`,
          dash(l.surgeW, "W"),
          `${l.voltageV} V`,
          l.simultaneous ? "yes" : "no",
        ]),
        "Loads (stand-alone sizing)",
      ),
    );
  }
  return blocks;
}

function reviewBlocks(input: PacketInput): Block[] {
  const notes = input.reviewNotes ?? [];
  const blocks: Block[] = [];
  blocks.push(
    table(
      [["Target", 1], ["Note", 4], ["Author", 1.2]],
      notes.length ? notes.map((n) => [n.target, n.text, n.author]) : [["—", "No review notes on this revision.", ""]],
      "Review notes",
    ),
  );
  const open = input.run.results.filter((r) => r.status === "fail" || r.status === "needs-input" || r.status === "attest" || r.status === "warning");
  blocks.push(
    table(
      [["Status", 1.1], ["Check", 3], ["Subject", 0.8], ["Code reference", 2]],
      open.length
        ? open.map((r) => [{ text: "", status: r.status }, r.title, r.subject ?? "—", r.codeRefs.join("; ")])
        : [["—", "No open points.", "", ""]],
      "Points for the reviewer (fail, needs input, warning, attest)",
    ),
  );
  const dispositions = input.approval?.dispositions ?? [];
  if (input.approval) {
    blocks.push(
      table(
        [["Attest item", 3], ["Disposition", 1.1], ["Reviewer's note", 3.5]],
        dispositions.length
          ? dispositions.map((d) => [d.item, d.disposition === "accepted" ? "Accepted" : "Returned", d.note || "—"])
          : [["—", "", "No attest items in this revision."]],
        "Dispositions of the attest items",
      ),
    );
  }
  return blocks;
}

export interface BuildOptions {
  /** Packet page ranges per sheet code, for the sheet index (known after a first layout pass). */
  sheetPages?: Map<string, string>;
}

export function buildPacketModel(input: PacketInput, options: BuildOptions = {}): PacketModel {
  const { record, revision, approval } = input;
  const sheetPages = options.sheetPages ?? new Map<string, string>();
  const datasheets: PacketDatasheet[] = input.datasheets.map((d, i) => ({
    code: `D-${String(i + 1).padStart(3, "0")}`,
    title: d.equipmentTag ? `${d.title} (${d.equipmentTag})` : d.title,
    equipmentTag: d.equipmentTag,
    bytes: d.bytes,
  }));
  const missingDocs = missingDocuments(input);
  const reasons = draftReasons(input, missingDocs);
  const draft = { isDraft: reasons.length > 0, reasons };

  const sheets: Sheet[] = SHEET_PLAN.map((plan) => {
    const context = templateContext(input, { code: plan.code, title: plan.title, kind: plan.kind }, sheetPages, datasheets, draft);
    const blocks = renderSheetTemplate(plan.template, context, input.templateOverrides?.[plan.template]);
    switch (plan.kind) {
      case "site-plan":
        blocks.push(...sitePlanBlocks(input));
        break;
      case "one-line":
        blocks.unshift({ kind: "figure", figure: "one-line", caption: "One-line diagram" });
        break;
      case "energy-storage":
        blocks.push(...storageBlocks(input));
        break;
      case "calculations":
        blocks.push(...input.run.results.map((result): Block => ({ kind: "check", result })));
        break;
      case "conductor-schedule":
        blocks.push(...conductorBlocks(input));
        break;
      case "equipment-schedule":
        blocks.push(...equipmentBlocks(input, datasheets));
        break;
      case "label-schedule":
        blocks.push({ kind: "labels", labels: input.labels });
        break;
      case "review-record":
        blocks.push(...reviewBlocks(input));
        break;
      default:
        break;
    }
    return { code: plan.code, title: plan.title, kind: plan.kind, columns: plan.columns, blocks };
  });

  const approvalLines = approval
    ? [
        `Approved ${isoDate(approval.approvedAt)} by ${approval.reviewerName}, licence ${approval.licenceNumber} (${approval.licenceState}, ${approval.licenceDiscipline})`,
        `Record SHA-256 ${approval.recordSha256}`,
      ]
    : [];

  return {
    titleBlock: {
      firm: revision.organisation,
      preparedBy: revision.preparedBy,
      project: record.name,
      client: record.client,
      address: record.site.address,
      jurisdiction: record.jurisdiction.name,
      edition: `NEC ${input.run.edition}`,
      revision: String(revision.number),
      date: isoDate(revision.createdAt),
    },
    sheets,
    datasheets,
    marking: { approved: Boolean(approval), reviewText: REVIEW_MARKING, approvalLines, footer: AHJ_FOOTER },
    draft,
    missingDocuments: missingDocs,
  };
}
