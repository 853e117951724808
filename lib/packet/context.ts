import type { ProjectRecord } from "../schemas/project-record";
import { dash, datedTime, formatNumber, isoDate } from "./format";
import { SHEET_PLAN, type PacketDatasheet } from "./plan";
import { batteryKWh, DEFAULT_VOLTAGE_DROP_LIMIT_PCT, isInverter } from "../schemas/vocabulary";
import { KIND_LABEL, LOCATION_LABEL, OCCUPANCY_LABEL, SYSTEM_KIND_LABEL, describe, equipmentByTag } from "./sheets/shared";
import type { TemplateContext } from "./templates";
import type { PacketInput } from "./types";

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
    if (isInverter(e) && e.continuousW) {
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
    } else if (isInverter(e)) {
      lines.push(`${KIND_LABEL[e.kind]} ${e.tag}: ${describe(e) || e.kind}, ${dash(e.continuousW, "W")} continuous, ${e.acOutput ?? dash(e.acOutputVoltageV)} V AC output.`);
    } else if (e.kind === "charge-controller") {
      lines.push(`Charge controller ${e.tag}: ${describe(e) || "controller"}${e.controllerType ? ` (${e.controllerType.toUpperCase()})` : ""}.`);
    } else if (e.kind === "generator") {
      lines.push(`Generator ${e.tag}: ${describe(e) || "generator"}, ${dash(e.ratedKW, "kW")}${e.fuel ? `, ${e.fuel}` : ""}.`);
    }
  }
  return lines;
}

export function templateContext(input: PacketInput, sheet: { code: string; title: string; kind: string }, sheetPages: Map<string, string>, datasheets: PacketDatasheet[], draft: { isDraft: boolean; reasons: string[] }, sheetNumbers?: Map<string, string>): TemplateContext {
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
    firm: {
      name: revision.organisation,
      preparedBy: revision.preparedBy,
      licence: revision.organisationLicence?.number
        ? [revision.organisationLicence.number, revision.organisationLicence.classification, revision.organisationLicence.state].filter(Boolean).join(", ")
        : "",
      contact: [revision.organisationContact?.phone, revision.organisationContact?.email, revision.organisationContact?.address].filter(Boolean).join(", "),
    },
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
      voltageDropLimitPct: formatNumber(record.jurisdiction.voltageDropLimitPct ?? DEFAULT_VOLTAGE_DROP_LIMIT_PCT),
      requiredDocuments: record.jurisdiction.requiredDocuments,
    },
    revision: { number: String(revision.number), date: isoDate(revision.createdAt), createdAt: datedTime(revision.createdAt) },
    revisions: (input.revisionHistory ?? [{ number: revision.number, date: revision.createdAt, change: "This issue", by: revision.preparedBy }]).map((r) => ({
      number: String(r.number),
      date: isoDate(r.date),
      change: r.change,
      by: r.by || "—",
    })),
    sheet: { code: sheet.code, title: sheet.title, kind: sheet.kind },
    sheets: [
      ...SHEET_PLAN.map((s) => ({ code: sheetNumbers?.get(s.code) ?? s.code, title: s.title, pages: sheetPages.get(s.code) ?? "" })),
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
