import { missingDocuments as missingOnFileDocuments } from "../compliance/documents";
import { templateContext } from "./context";
import { isoDate } from "./format";
import type { Block } from "./markup";
import { AHJ_FOOTER, REVIEW_MARKING, SHEET_PLAN, type PacketDatasheet, type PacketModel, type Sheet } from "./plan";
import { conductorBlocks } from "./sheets/conductors";
import { equipmentBlocks } from "./sheets/equipment";
import { reviewBlocks } from "./sheets/review-record";
import { sitePlanBlocks } from "./sheets/site-plan";
import { storageBlocks } from "./sheets/storage";
import { renderSheetTemplate } from "./templates";
import type { PacketInput } from "./types";

export * from "./plan";
export { templateContext };

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

<<<<<<< HEAD
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

=======
>>>>>>> main
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
