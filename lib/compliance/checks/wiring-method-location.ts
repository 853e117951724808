/**
 * Wiring method against its location, per circuit:
 *   - the insulation is a real type (Table 310.104(A) in 2017, 310.4(A) from 2020) whose temperature rating is the
 *     one entered; underground raceways and raceways exposed on roofs are wet locations, where the type must be
 *     wet-rated and its wet rating applies (310.10(C));
 *   - flexible cord is no substitute for fixed wiring (400.12); the one use a stand-alone system has for it, a
 *     portable generator's cord to its inlet, is confirmed by a person;
 *   - welding cable is not a premises wiring method (110.8; it is for welder secondary circuits, 630.42);
 *   - single conductors in cable tray only as 392.10(B)(1) allows (1/0 and larger, marked for tray, industrial
 *     establishments with qualified persons), or PV wire and USE-2 in outdoor tray from 2020 (690.31(C)(1));
 *   - conductors finer than Class B or C stranding land on terminals identified for them (110.14).
 * Battery and inverter DC circuits ask whether the conductor is fine-stranded, since flexible battery cable is
 * common there; elsewhere building wire is taken as Class B or C, the stranding its product standard gives it.
 */
import type { Circuit } from "../../schemas/project-record";
import { isPvCircuit, sizeLabel, Trace, v, type CheckContext, type Indexed } from "../context";
import { remedy } from "../derive/remedy";
import { refs } from "../refs";
import { makeResult, needsInput, type CheckDefinition } from "../result";
import { compareConductorSize, type CodeTopic } from "../tables";
import { insulationType, racewayType, type InsulationType } from "../tables/wiring-types";
import type { CheckResult, CheckStatus, CheckValue, Remedy } from "../types";

/** 392.10(B)(1)(a): single-conductor cable in tray is 1/0 AWG or larger (from memory). */
export const TRAY_SINGLE_CONDUCTOR_MIN_SIZE = "1/0";

/** Wiring methods that put the conductor in a wet location: underground (300.5(B)) or a raceway exposed on a roof (300.9). */
const UNDERGROUND_METHODS = ["HDPE", "DIRECT-BURIAL"];

/** Circuit kinds where flexible, fine-stranded battery cable is common practice, so the record must say. */
const FINE_STRAND_KINDS: readonly Circuit["kind"][] = ["battery", "inverter-dc-input"];

interface Finding {
  status: Exclude<CheckStatus, "needs-input" | "not-applicable">;
  text: string;
  topic: CodeTopic;
  remedy?: Remedy;
}

const SEVERITY: Finding["status"][] = ["fail", "warning", "attest", "pass"];

export const wiringMethodLocation: CheckDefinition = {
  id: "wiring-method-location",
  title: "Wiring method against location",
  scopeTopic: "insulation-table",
  formula:
    "insulation a listed type whose rating (wet rating in a wet location) is the one entered; no flexible cord as fixed wiring; no welding cable; single conductors in cable tray only as 392.10(B)(1) allows; fine-stranded conductors on terminals identified for them",
  run(ctx: CheckContext): CheckResult[] {
    return ctx.circuits.map((ci) => checkCircuit(this, ctx, ci));
  },
};

function checkCircuit(def: CheckDefinition, ctx: CheckContext, ci: Indexed<Circuit>): CheckResult {
  const c = ci.item;
  const ed = ctx.edition;
  const t = new Trace();
  const findings: Finding[] = [];
  const values: CheckValue[] = [];

  const code = t.need(`${ci.path}.insulation`, `Insulation of ${c.tag}`, c.insulation === "" ? undefined : c.insulation);
  const type = code !== undefined ? insulationType(code) : undefined;
  const method = c.racewayType === "" ? undefined : c.racewayType;
  t.read(`${ci.path}.racewayType`, `Wiring method of ${c.tag}`, method);
  t.read(`${ci.path}.onRooftop`, `${c.tag} on a rooftop`, c.onRooftop);
  const wet = (method !== undefined && UNDERGROUND_METHODS.includes(method)) || c.onRooftop;

  if (code !== undefined && !type) {
    // The schema refuses unknown types; a record built outside it still gets an answer, never a pass.
    findings.push({
      status: "fail",
      text: `"${code}" is not an insulation type of the table`,
      topic: "insulation-table",
      remedy: remedy(`Choose ${c.tag}'s insulation from the list of types, e.g. THWN-2 (90 °C wet and dry).`, { path: `${ci.path}.insulation`, value: "THWN-2" }),
    });
  }
  if (type) {
    values.push(v("insulation", "Insulation type", type.code), v("wetLocation", "Wet location", wet));
    findings.push(...insulationFindings(ci, type, wet, t, values));
    findings.push(...classFindings(ci, type));
    findings.push(...trayFindings(ctx, ci, type, t));
  }
  findings.push(...fineStrandFindings(ci, type, t));

  const topics = new Set<CodeTopic>(["insulation-table", ...findings.map((f) => f.topic)]);
  const codeRefs = refs(ed, ...topics);
  const formula = findings.map((f) => f.text).join("; ");
  const status = SEVERITY.find((s) => findings.some((f) => f.status === s)) ?? "pass";
  // A fail stands whatever the missing fields hold (a cord is no fixed wiring on any terminals); else missing asks.
  if (status !== "fail" && t.missing.length > 0) return needsInput(def, { subject: c.tag, values, formula, inputs: t.inputs, missing: t.missing, codeRefs });
  const shown = findings.filter((f) => f.status === status);
  const text = shown.map((f) => f.text).join("; ");
  const base = { subject: c.tag, message: `${c.tag}: ${text}.`, values, formula, inputs: t.inputs, missing: t.missing, codeRefs };
  if (status === "fail") {
    const remedies = shown.map((f) => f.remedy!).slice(0, 2);
    return makeResult(def, {
      ...base,
      status,
      reason: text,
      remedy: remedy(remedies.map((r) => r.text).join(" "), ...remedies.flatMap((r) => r.changes)),
    });
  }
  if (status === "warning") return makeResult(def, { ...base, status, reason: text, ...(shown[0]?.remedy ? { remedy: shown[0].remedy } : {}) });
  if (status === "attest") return makeResult(def, { ...base, status, reason: text });
  return makeResult(def, { ...base, status: "pass" });
}

/** The entered rating against the type's: its dry rating, or its wet rating in a wet location. */
function insulationFindings(ci: Indexed<Circuit>, type: InsulationType, wet: boolean, t: Trace, values: CheckValue[]): Finding[] {
  const c = ci.item;
  const out: Finding[] = [];
  const path = `${ci.path}.insulationTempRatingC`;
  const entered = t.need(path, `Insulation rating of ${c.tag}`, c.insulationTempRatingC, "°C");
  if (wet && type.wetRatingC === undefined) {
    out.push({
      status: "fail",
      text: `${type.code} is not a wet-location type, and ${c.onRooftop ? "a raceway exposed on a roof" : "an underground run"} is a wet location`,
      topic: "wet-location-conductors",
      remedy: remedy(`Use a wet-rated type for ${c.tag}, e.g. THWN-2 (90 °C wet).`, { path: `${ci.path}.insulation`, value: "THWN-2" }, { path, value: 90 }),
    });
    return out;
  }
  const rating = wet ? type.wetRatingC! : type.dryRatingC;
  values.push(v("typeRatingC", wet ? "Wet rating of the type" : "Rating of the type", rating, "°C"));
  if (entered === undefined) return out;
  if (entered > rating) {
    out.push({
      status: "fail",
      text: `${entered} °C entered, but ${type.code} is rated ${rating} °C${wet ? " wet" : ""}`,
      topic: wet ? "wet-location-conductors" : "insulation-table",
      remedy: remedy(`Enter ${rating} °C for ${type.code} on ${c.tag}, or choose a ${entered} °C type.`, { path, value: rating }),
    });
  } else if (entered === rating || entered === type.dryRatingC || entered === type.wetRatingC) {
    out.push({ status: "pass", text: `${type.code} at ${entered} °C${wet ? " in a wet location" : ""}`, topic: "insulation-table" });
  } else {
    // A lower figure is safe for ampacity but is not what the conductor is; the schedule would misdescribe it.
    out.push({
      status: "warning",
      text: `${entered} °C entered for ${type.code}, rated ${rating} °C`,
      topic: "insulation-table",
      remedy: remedy(`Enter ${rating} °C, the rating of ${type.code}.`, { path, value: rating }),
    });
  }
  return out;
}

/** Cords and welding cable are not fixed premises wiring. */
function classFindings(ci: Indexed<Circuit>, type: InsulationType): Finding[] {
  const c = ci.item;
  if (type.conductorClass === "flexible-cord") {
    if (c.kind === "generator-output") {
      return [
        {
          status: "attest",
          text: `${type.code} cord on a generator circuit: permitted only as a portable generator's cord to its inlet, not as fixed wiring (400.12)`,
          topic: "flexible-cord-uses-not-permitted",
        },
      ];
    }
    return [
      {
        status: "fail",
        text: `${type.code} flexible cord used as fixed wiring`,
        topic: "flexible-cord-uses-not-permitted",
        remedy: remedy(`Wire ${c.tag} with building wire in raceway (e.g. THWN-2) or a Chapter 3 cable instead of cord.`, { path: `${ci.path}.insulation`, value: "THWN-2" }),
      },
    ];
  }
  if (type.conductorClass === "welding-cable") {
    return [
      {
        status: "fail",
        text: "welding cable is not a premises wiring method",
        topic: "wiring-methods-recognised",
        remedy: remedy(`Wire ${c.tag} with a listed building wire (e.g. THWN-2, or a flexible type listed as building wire) in raceway.`, {
          path: `${ci.path}.insulation`,
          value: "THWN-2",
        }),
      },
    ];
  }
  return [];
}

/** Single conductors in cable tray. */
function trayFindings(ctx: CheckContext, ci: Indexed<Circuit>, type: InsulationType, t: Trace): Finding[] {
  const c = ci.item;
  if (racewayType(c.racewayType)?.code !== "CABLE-TRAY" || type.conductorClass !== "building-wire") return [];
  if (ctx.edition !== "2017" && isPvCircuit(c) && (type.code === "PV WIRE" || type.code === "USE-2")) {
    return [
      {
        status: "attest",
        text: `single-conductor ${type.code} in cable tray: permitted outdoors, supported at most every 12 in and secured at most every 4.5 ft`,
        topic: "pv-single-conductor-tray",
      },
    ];
  }
  const size = t.need(`${ci.path}.size`, `Size of ${c.tag}`, c.size);
  if (size === undefined) return [];
  if (compareConductorSize(size, TRAY_SINGLE_CONDUCTOR_MIN_SIZE) >= 0) {
    return [
      {
        status: "attest",
        text: `single conductors (${sizeLabel(size, c.material)}) in cable tray: only where the conductors are marked for tray use and, in an industrial establishment, only qualified persons service the tray`,
        topic: "cable-tray-single-conductors",
      },
    ];
  }
  return [
    {
      status: "fail",
      text: `single ${sizeLabel(size, c.material)} conductors in cable tray, below the ${TRAY_SINGLE_CONDUCTOR_MIN_SIZE} AWG that 392.10(B)(1) allows`,
      topic: "cable-tray-single-conductors",
      remedy: remedy(`Run ${c.tag} in raceway (e.g. EMT) through the tray's route, or use MC cable, which a tray may carry.`, { path: `${ci.path}.racewayType`, value: "EMT" }),
    },
  ];
}

/** Fine-stranded conductors need terminals identified for their class. */
function fineStrandFindings(ci: Indexed<Circuit>, type: InsulationType | undefined, t: Trace): Finding[] {
  const c = ci.item;
  // Cords (Class K/M) and welding cable are fine-stranded by construction.
  const byConstruction = type !== undefined && (type.conductorClass === "flexible-cord" || type.conductorClass === "welding-cable");
  let fine: boolean | undefined;
  if (byConstruction) fine = true;
  else if (FINE_STRAND_KINDS.includes(c.kind)) fine = t.need(`${ci.path}.fineStranded`, `${c.tag} fine-stranded`, c.fineStranded);
  else fine = t.readOr(`${ci.path}.fineStranded`, `${c.tag} fine-stranded`, c.fineStranded, false);
  if (fine !== true) return fine === false ? [{ status: "pass", text: "Class B or C stranding", topic: "insulation-table" }] : [];
  const identified = t.need(`${ci.path}.fineStrandTerminalsIdentified`, `${c.tag} terminals identified for fine strand`, c.fineStrandTerminalsIdentified);
  if (identified === true) return [{ status: "pass", text: "fine-stranded, on terminals identified for it", topic: "fine-strand-terminals" }];
  if (identified === false) {
    return [
      {
        status: "fail",
        text: "fine-stranded conductor on terminals not identified for it",
        topic: "fine-strand-terminals",
        remedy: remedy(`Use lugs and terminals identified for ${c.tag}'s fine stranding (Class K or M), or a Class B or C conductor.`),
      },
    ];
  }
  return [];
}
