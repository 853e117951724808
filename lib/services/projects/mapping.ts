import "server-only";
import type {
  Attachment,
  CircuitRow,
  Jurisdiction,
  LoadRow,
  Project,
  ProjectEquipmentRow,
  PvArrayRow,
} from "../../../db/schema";
import type { ProjectRecordInput } from "../../schemas/project-record";
import { withKnownWiringCodes } from "../../schemas/wiring-codes";

/** Site and project fields held in columns; anything else of the record lands in `extra`. */
const SITE_COLUMNS = [
  "address",
  "occupancy",
  "mounting",
  "roofClearanceIn",
  "designLowTempC",
  "designLowTempSource",
  "designHighTempC",
  "designHighTempSource",
  "sunHoursPerDay",
  "batteryLocation",
  "batteryLocationNote",
  "batterySpacingIn",
  "hasSmokeOrHeatDetection",
  "hasVehicleImpactProtection",
] as const;

const RECORD_KEYS_IN_ROWS = new Set([
  "format",
  "formatVersion",
  "name",
  "client",
  "systemKind",
  "site",
  "jurisdiction",
  "daysOfAutonomy",
  "rapidShutdownMethod",
  "equipment",
  "arrays",
  "circuits",
  "loads",
  "attachments",
]);

const nullToUndefined = <T>(v: T | null): T | undefined => (v === null ? undefined : v);

export interface ProjectRows {
  project: Project;
  jurisdiction: Jurisdiction | null;
  equipment: ProjectEquipmentRow[];
  arrays: PvArrayRow[];
  circuits: CircuitRow[];
  loads: LoadRow[];
  attachments: Attachment[];
}

/** Assembles the engine's project record from the stored rows. */
export function rowsToRecord(rows: ProjectRows): ProjectRecordInput {
  const { project: p, jurisdiction: j } = rows;
  const extra = (p.extra ?? {}) as Record<string, unknown>;
  const siteExtra = (extra.site ?? {}) as Record<string, unknown>;
  const site: Record<string, unknown> = { ...siteExtra };
  for (const key of SITE_COLUMNS) {
    const value = nullToUndefined(p[key] as unknown);
    if (value !== undefined) site[key] = value;
  }
  const { site: _ignored, ...recordExtra } = extra;
  return {
    ...recordExtra,
    format: "sundocket-project",
    formatVersion: 1,
    name: p.name,
    client: p.client,
    systemKind: p.systemKind,
    site: site as ProjectRecordInput["site"],
    jurisdiction: j
      ? {
          name: j.name,
          necEdition: j.necEdition,
          residentialCode: j.residentialCode,
          voltageDropLimitPct: nullToUndefined(j.voltageDropLimitPct),
          storageAggregateLimitKWh: nullToUndefined(j.storageAggregateLimitKWh),
          requiredDocuments: j.requiredDocuments as ProjectRecordInput["jurisdiction"]["requiredDocuments"],
        }
      : { name: "(no jurisdiction chosen)", necEdition: "2023" },
    daysOfAutonomy: nullToUndefined(p.daysOfAutonomy),
    rapidShutdownMethod: nullToUndefined(p.rapidShutdownMethod) as ProjectRecordInput["rapidShutdownMethod"],
    equipment: [...rows.equipment]
      .sort((a, b) => a.position - b.position)
      .map((e) => ({ ...e.data, tag: e.tag, kind: e.kind, quantity: e.quantity, libraryItemId: e.libraryItemId ?? undefined }) as never),
    arrays: [...rows.arrays]
      .sort((a, b) => a.position - b.position)
      .map((a) => ({
        tag: a.tag,
        moduleTag: a.moduleTag,
        modulesInSeries: a.modulesInSeries,
        stringsInParallel: a.stringsInParallel,
        feedsTag: a.feedsTag,
        mpptInputId: nullToUndefined(a.mpptInputId),
      })),
    circuits: [...rows.circuits]
      .sort((a, b) => a.position - b.position)
      .map((c) => ({ ...withKnownWiringCodes(c.data), tag: c.tag, fromTag: c.fromTag, toTag: c.toTag, kind: c.kind }) as never),
    loads: [...rows.loads]
      .sort((a, b) => a.position - b.position)
      .map((l) => ({
        name: l.name,
        watts: l.watts,
        quantity: l.quantity,
        hoursPerDay: l.hoursPerDay,
        dutyPct: nullToUndefined(l.dutyPct),
        daysPerWeek: nullToUndefined(l.daysPerWeek),
        surgeW: nullToUndefined(l.surgeW),
        voltageV: l.voltageV as 120 | 240,
        simultaneous: l.simultaneous,
      })),
    attachments: rows.attachments.map((a) => ({
      id: a.id,
      kind: a.kind,
      equipmentTag: nullToUndefined(a.equipmentTag),
      fileName: a.fileName,
      pageCount: nullToUndefined(a.pageCount),
      sha256: a.sha256,
    })),
  };
}

type Parsed = {
  name: string;
  client: string;
  systemKind: Project["systemKind"];
  site: Record<string, unknown>;
  daysOfAutonomy?: number;
  rapidShutdownMethod?: string;
  equipment: Array<{ tag: string; kind: string; quantity: number; libraryItemId?: string } & Record<string, unknown>>;
  arrays: Array<{ tag: string; moduleTag: string; modulesInSeries: number; stringsInParallel: number; feedsTag: string; mpptInputId?: string }>;
  circuits: Array<{ tag: string; fromTag: string; toTag: string; kind: string } & Record<string, unknown>>;
  loads: Array<{ name: string; watts: number; quantity: number; hoursPerDay: number; dutyPct?: number; daysPerWeek?: number; surgeW?: number; voltageV: number; simultaneous: boolean }>;
} & Record<string, unknown>;

/** Splits a validated record into the project columns and child rows (without ids). */
export function recordToRows(record: Parsed) {
  const siteExtra: Record<string, unknown> = {};
  const siteColumns: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(record.site)) {
    if ((SITE_COLUMNS as readonly string[]).includes(key)) siteColumns[key] = value ?? null;
    else siteExtra[key] = value;
  }
  for (const key of SITE_COLUMNS) if (!Object.hasOwn(siteColumns, key)) siteColumns[key] = null;
  const extra: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(record)) if (!RECORD_KEYS_IN_ROWS.has(key)) extra[key] = value;
  if (Object.keys(siteExtra).length) extra.site = siteExtra;
  return {
    project: {
      name: record.name,
      client: record.client,
      systemKind: record.systemKind,
      ...siteColumns,
      address: (siteColumns.address as string | null) ?? "",
      designLowTempSource: (siteColumns.designLowTempSource as string | null) ?? "",
      designHighTempSource: (siteColumns.designHighTempSource as string | null) ?? "",
      batteryLocationNote: (siteColumns.batteryLocationNote as string | null) ?? "",
      daysOfAutonomy: record.daysOfAutonomy ?? null,
      rapidShutdownMethod: record.rapidShutdownMethod ?? null,
      extra,
    } as Partial<Project>,
    equipment: record.equipment.map((e, position) => {
      const { tag, kind, quantity, libraryItemId, ...data } = e;
      return { tag, kind, quantity, libraryItemId: libraryItemId ?? null, position, data };
    }),
    arrays: record.arrays.map((a, position) => ({ ...a, mpptInputId: a.mpptInputId ?? null, position })),
    circuits: record.circuits.map((c, position) => {
      const { tag, fromTag, toTag, kind, ...data } = c;
      return { tag, fromTag, toTag, kind, position, data };
    }),
    loads: record.loads.map((l, position) => ({ ...l, surgeW: l.surgeW ?? null, dutyPct: l.dutyPct ?? null, daysPerWeek: l.daysPerWeek ?? null, position })),
  };
}
