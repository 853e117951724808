/** Property tests: the engine holds up on any valid record, and its figures move the way physics says. */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { CHECKS, runChecks } from "@/lib/compliance";
import { CIRCUIT_KINDS, CONDUCTOR_SIZES, NEC_EDITIONS } from "@/lib/schemas/project-record";
import { array, circuit, equipment, exampleJson, parse, result, run, type Json } from "./fixtures";

const opt = <T>(a: fc.Arbitrary<T>) => fc.option(a, { nil: undefined });
const strip = (o: Record<string, unknown>) => Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined));

const moduleArb = fc.record({
  vocV: opt(fc.double({ min: 20, max: 60, noNaN: true })),
  iscA: opt(fc.double({ min: 3, max: 15, noNaN: true })),
  vmpRatio: fc.double({ min: 0.7, max: 0.9, noNaN: true }),
  impRatio: fc.double({ min: 0.85, max: 0.98, noNaN: true }),
  pmaxW: opt(fc.integer({ min: 50, max: 700 })),
  tempCoeffVocPctPerC: opt(fc.double({ min: -0.5, max: -0.2, noNaN: true })),
  tempCoeffVmpPctPerC: opt(fc.double({ min: -0.5, max: -0.25, noNaN: true })),
  maxSeriesFuseA: opt(fc.integer({ min: 10, max: 30 })),
  maxSystemVoltageV: opt(fc.constantFrom(600, 1000, 1500)),
});

const recordArb = fc
  .record({
    edition: fc.constantFrom(...NEC_EDITIONS),
    systemKind: fc.constantFrom("stand-alone", "stand-alone-generator", "hybrid"),
    occupancy: fc.constantFrom("one-two-family-dwelling", "other-building"),
    mounting: fc.constantFrom("ground", "roof"),
    lowC: opt(fc.integer({ min: -60, max: 30 })),
    highC: opt(fc.integer({ min: 0, max: 50 })),
    sun: opt(fc.double({ min: 0.5, max: 12, noNaN: true })),
    location: opt(fc.constantFrom("utility-closet", "basement", "garage", "outdoors", "habitable-room", "exterior-wall")),
    residentialCode: fc.constantFrom("IRC-2018", "IRC-2021", "IRC-2024", "none"),
    rsd: opt(fc.constantFrom("module-level", "array-boundary", "listed-pv-hazard-control", "none")),
    module: moduleArb,
    controller: fc.record({
      maxPvInputVoltageV: opt(fc.integer({ min: 50, max: 600 })),
      ratedOutputCurrentA: opt(fc.integer({ min: 10, max: 100 })),
      mpptMinVoltageV: opt(fc.integer({ min: 10, max: 100 })),
    }),
    inverter: fc.record({
      kind: fc.constantFrom("inverter", "inverter-charger", "hybrid-inverter"),
      continuousW: opt(fc.integer({ min: 200, max: 15000 })),
      surgeW: opt(fc.integer({ min: 200, max: 30000 })),
      minBatteryVoltageV: opt(fc.double({ min: 10, max: 50, noNaN: true })),
      efficiencyPct: opt(fc.double({ min: 80, max: 98, noNaN: true })),
      idleW: opt(fc.integer({ min: 0, max: 100 })),
      acOutput: opt(fc.constantFrom("120", "240", "120/240")),
      listedMode: opt(fc.constantFrom("stand-alone", "multimode", "interactive")),
      inputs: fc.integer({ min: 0, max: 3 }),
    }),
    battery: fc.record({
      nominalVoltageV: opt(fc.constantFrom(12.8, 25.6, 51.2)),
      capacityKWh: opt(fc.double({ min: 0.5, max: 30, noNaN: true })),
      quantity: fc.integer({ min: 1, max: 8 }),
      shortCircuitCurrentA: opt(fc.integer({ min: 500, max: 20000 })),
      usableDodPct: opt(fc.integer({ min: 50, max: 100 })),
      maxContinuousDischargeA: opt(fc.integer({ min: 20, max: 300 })),
      chemistry: opt(fc.constantFrom("lfp", "nmc", "lead-acid-agm", "other")),
    }),
    devices: fc.array(
      fc.record({
        kind: fc.constantFrom("fuse", "breaker", "disconnect"),
        ratingA: opt(fc.constantFrom(15, 20, 30, 40, 42, 60, 100, 125, 200, 250, 400)),
        voltageRatingV: opt(fc.constantFrom(48, 125, 250, 600, 1000)),
        currentType: opt(fc.constantFrom("ac", "dc", "ac-dc")),
        interruptingRatingA: opt(fc.constantFrom(1000, 5000, 10000, 20000)),
        distanceFromBatteryFt: opt(fc.double({ min: 0, max: 50, noNaN: true })),
      }),
      { minLength: 0, maxLength: 4 },
    ),
    arrays: fc.array(
      fc.record({ series: fc.integer({ min: 1, max: 24 }), strings: fc.integer({ min: 1, max: 6 }), toInverter: fc.boolean(), input: fc.nat(3) }),
      { minLength: 0, maxLength: 3 },
    ),
    circuits: fc.array(
      fc.record({
        kind: fc.constantFrom(...CIRCUIT_KINDS),
        from: fc.nat(20),
        to: fc.nat(20),
        size: opt(fc.constantFrom(...CONDUCTOR_SIZES)),
        material: fc.constantFrom("cu", "al"),
        ins: opt(fc.constantFrom(60, 75, 90)),
        term: opt(fc.constantFrom(60, 75, 90)),
        ccc: opt(fc.integer({ min: 1, max: 60 })),
        lengthFt: opt(fc.double({ min: 0, max: 5000, noNaN: true })),
        ambient: opt(fc.integer({ min: -60, max: 70 })),
        onRooftop: fc.boolean(),
        clearance: opt(fc.double({ min: 0, max: 120, noNaN: true })),
        ocpd: opt(fc.nat(3)),
        egc: opt(fc.constantFrom(...CONDUCTOR_SIZES)),
        sets: fc.integer({ min: 1, max: 8 }),
        loadCurrentA: opt(fc.double({ min: 0, max: 500, noNaN: true })),
        designCurrentA: opt(fc.double({ min: 0, max: 500, noNaN: true })),
      }),
      { minLength: 0, maxLength: 12 },
    ),
    loads: fc.array(
      fc.record({ watts: fc.double({ min: 0, max: 5000, noNaN: true }), hoursPerDay: fc.double({ min: 0, max: 24, noNaN: true }), surgeW: opt(fc.integer({ min: 0, max: 20000 })), simultaneous: fc.boolean() }),
      { maxLength: 6 },
    ),
  })
  .map((g) => {
    const inputs = Array.from({ length: g.inverter.inputs }, (_, i) => ({ id: String.fromCharCode(65 + i), maxVoltageV: 500, maxCurrentA: 20, minOperatingVoltageV: 100, maxOperatingVoltageV: 450 }));
    const m = g.module;
    const equipmentList: Json[] = [
      strip({ tag: "MOD-1", kind: "pv-module", ...m, vmpRatio: undefined, impRatio: undefined, vmpV: m.vocV !== undefined ? m.vocV * m.vmpRatio : undefined, impA: m.iscA !== undefined ? m.iscA * m.impRatio : undefined }),
      strip({ tag: "CC-1", kind: "charge-controller", ...g.controller }),
      strip({ tag: "INV-1", ...g.inverter, inputs: undefined, mpptInputs: inputs }),
      strip({ tag: "BAT-1", kind: "battery", ...g.battery }),
      { tag: "GEN-1", kind: "generator", ratedKW: 5, voltageV: 240 },
      { tag: "P-1", kind: "ac-panel", busRatingA: 200, mainBreakerA: 200, voltage: "120/240" },
      { tag: "BB-1", kind: "busbar", busRatingA: 600 },
      { tag: "RSD-1", kind: "rapid-shutdown", method: "module-level" },
      ...g.devices.map((d, i) => strip({ tag: `D-${i}`, ...d })),
    ];
    const arrays = g.arrays.map((a, i) => {
      const onInverter = a.toInverter && inputs.length > 0;
      return strip({
        tag: `PV-${i}`,
        moduleTag: "MOD-1",
        modulesInSeries: a.series,
        stringsInParallel: a.strings,
        feedsTag: onInverter ? "INV-1" : "CC-1",
        mpptInputId: onInverter ? inputs[a.input % inputs.length]!.id : undefined,
      });
    });
    const eqTags = equipmentList.map((e) => e.tag as string);
    const ocpds = equipmentList.filter((e) => e.kind === "fuse" || e.kind === "breaker").map((e) => e.tag as string);
    const circuits = g.circuits.map((c, i) => {
      const pv = c.kind === "pv-source" || c.kind === "pv-output";
      const pool = pv && arrays.length ? [...arrays.map((a) => a.tag as string), ...eqTags] : eqTags;
      let from = pool[c.from % pool.length]!;
      let to = pool[c.to % pool.length]!;
      if (from === to) to = pool[(c.to + 1) % pool.length]!;
      if (from === to) from = "MOD-1";
      return strip({
        tag: `C-${i}`,
        fromTag: from,
        toTag: to,
        kind: c.kind,
        arrayTag: pv && arrays.length ? (arrays[c.from % arrays.length]!.tag as string) : undefined,
        size: c.size,
        material: c.material,
        insulationTempRatingC: c.ins,
        terminalTempRatingC: c.term,
        currentCarryingConductors: c.ccc,
        lengthFt: c.lengthFt,
        ambientTempC: c.ambient,
        onRooftop: c.onRooftop,
        roofClearanceIn: c.clearance,
        ocpdTag: c.ocpd !== undefined && ocpds.length ? ocpds[c.ocpd % ocpds.length] : undefined,
        egcSize: c.egc,
        parallelSets: c.sets,
        loadCurrentA: c.loadCurrentA,
        designCurrentA: c.designCurrentA,
      });
    });
    return {
      edition: g.edition,
      json: strip({
        name: "Generated",
        systemKind: g.systemKind,
        site: strip({ occupancy: g.occupancy, mounting: g.mounting, designLowTempC: g.lowC, designHighTempC: g.highC, sunHoursPerDay: g.sun, batteryLocation: g.location }),
        jurisdiction: { name: "Test Township", necEdition: g.edition, residentialCode: g.residentialCode },
        rapidShutdownMethod: g.rsd,
        equipment: equipmentList,
        arrays,
        circuits,
        loads: g.loads.map((l, i) => strip({ name: `Load ${i}`, ...l })),
      }),
    };
  });

function allNumbersFinite(x: unknown): boolean {
  if (typeof x === "number") return Number.isFinite(x);
  if (Array.isArray(x)) return x.every(allNumbersFinite);
  if (x && typeof x === "object") return Object.values(x).every(allNumbersFinite);
  return true;
}

describe("any valid record", () => {
  it("never throws, never yields NaN or Infinity, and every result cites the code", () => {
    fc.assert(
      fc.property(recordArb, fc.constantFrom(...NEC_EDITIONS), ({ json }, edition) => {
        const record = parse(json);
        const out = runChecks(record, { edition });
        expect(allNumbersFinite(out)).toBe(true);
        for (const r of out.results) {
          const text = JSON.stringify(r);
          expect(/NaN|Infinity/.test(text) ? `${r.id}: ${text.slice(0, 300)}` : "").toBe("");
          expect(r.codeRefs.length, r.id).toBeGreaterThan(0);
          expect(r.codeRefs.every((c) => c.length > 0)).toBe(true);
          if (r.status === "needs-input") expect(r.missing.length, r.id).toBeGreaterThan(0);
        }
        expect(new Set(out.results.map((r) => r.id)).size).toBe(out.results.length);
        expect(new Set(out.results.map((r) => r.checkId)).size).toBe(CHECKS.length);
      }),
      { numRuns: Number(process.env.PROPERTY_RUNS ?? 300) },
    );
  }, 120_000);
});

describe("the figures move the right way", () => {
  it("a colder design low temperature never lowers the maximum voltage", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: -60, max: 40 }),
        fc.integer({ min: -60, max: 40 }),
        fc.double({ min: 20, max: 60, noNaN: true }),
        fc.option(fc.double({ min: -0.5, max: -0.2, noNaN: true }), { nil: undefined }),
        fc.integer({ min: 1, max: 3 }),
        (a, b, voc, coeff, n) => {
          const [cold, warm] = a <= b ? [a, b] : [b, a];
          const voltage = (lowC: number) => {
            const j = exampleJson("tamarack-hut");
            j.site.designLowTempC = lowC;
            equipment(j, "MOD-1").vocV = voc;
            if (coeff === undefined) delete equipment(j, "MOD-1").tempCoeffVocPctPerC;
            else equipment(j, "MOD-1").tempCoeffVocPctPerC = coeff;
            array(j, "PV-1").modulesInSeries = n;
            const r = result(run(j), "max-pv-voltage:PV-1");
            return r.values.find((x) => x.key === "maxVoltageV")?.value as number | undefined;
          };
          const vc = voltage(cold);
          const vw = voltage(warm);
          // Below −40 °C the table has no factor; the check then asks for the coefficient instead.
          if (vc === undefined || vw === undefined) return coeff === undefined && cold < -40;
          return vc >= vw - 1e-9;
        },
      ),
      { numRuns: 150 },
    );
  });

  it("a longer run never lowers the voltage drop", () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 5000, noNaN: true }), fc.double({ min: 0, max: 5000, noNaN: true }), fc.constantFrom("C-1", "C-2", "C-3", "C-4", "C-5"), (a, b, tag) => {
        const [short, long] = a <= b ? [a, b] : [b, a];
        const drop = (len: number) => {
          const j = exampleJson("tamarack-hut");
          circuit(j, tag).lengthFt = len;
          return result(run(j), `voltage-drop:${tag}`).values.find((x) => x.key === "dropPct")!.value as number;
        };
        return drop(long) >= drop(short);
      }),
      { numRuns: 150 },
    );
  });

  it("more current-carrying conductors never raise the allowed ampacity", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 60 }), fc.integer({ min: 1, max: 60 }), fc.constantFrom(...NEC_EDITIONS), fc.constantFrom("C-1", "C-3", "C-5"), (a, b, edition, tag) => {
        const [few, many] = a <= b ? [a, b] : [b, a];
        const allowed = (n: number) => {
          const j = exampleJson("tamarack-hut");
          circuit(j, tag).currentCarryingConductors = n;
          return result(run(j, edition), `conductor-ampacity:${tag}`).values.find((x) => x.key === "allowedA")!.value as number;
        };
        return allowed(many) <= allowed(few);
      }),
      { numRuns: 150 },
    );
  });

  it("a larger conductor never lowers the ampacity", () => {
    const sizes = CONDUCTOR_SIZES.filter((s) => s !== "18" && s !== "16");
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: sizes.length - 1 }),
        fc.integer({ min: 0, max: sizes.length - 1 }),
        fc.constantFrom("cu", "al"),
        fc.constantFrom(60, 75, 90),
        fc.option(fc.constantFrom(60, 75, 90), { nil: undefined }),
        fc.integer({ min: -10, max: 60 }),
        (i, k, material, ins, term, ambient) => {
          const [lo, hi] = i <= k ? [i, k] : [k, i];
          const allowed = (size: string) => {
            const j = exampleJson("ferncliff-farmhouse");
            const c = circuit(j, "C-4");
            c.size = size;
            c.material = material;
            c.insulationTempRatingC = ins;
            c.ambientTempC = ambient;
            if (term === undefined) delete c.terminalTempRatingC;
            else c.terminalTempRatingC = term;
            const v = result(run(j), "conductor-ampacity:C-4").values.find((x) => x.key === "allowedA")?.value;
            return typeof v === "number" ? v : 0;
          };
          // Aluminium has no 14 AWG entry in Table 310.16; "none" counts as zero ampacity.
          return allowed(sizes[hi]!) >= allowed(sizes[lo]!);
        },
      ),
      { numRuns: 200 },
    );
  });
});
