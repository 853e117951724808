"use client";

/**
 * Runs the check engine in the browser on the form's current values,
 * debounced, and shares the result with the panel, the diagram and the
 * loads summary. The editor's fields do not re-render on a run.
 */
import { createContext, useContext, useEffect, useRef, useState } from "react";
import { useFormContext } from "react-hook-form";
import { runChecks, type CheckRun } from "@/lib/compliance";
import type { ProjectRecord } from "@/lib/schemas/project-record";
import { parseLenient } from "./lenient-record";

/** Long enough to skip runs between keystrokes of a fast typist, short enough to feel live. */
const DEBOUNCE_MS = 200;

export interface LiveState {
  record: ProjectRecord | null;
  run: CheckRun | null;
  issues: { path: string; message: string }[];
  omitted: string[];
  pending: boolean;
  /** Milliseconds of the last engine run (runChecks only) and of the parse before it. */
  engineMs: number | null;
  parseMs: number | null;
  runs: number;
  /** Mean engine time over every run in this page. */
  meanEngineMs: number | null;
}

const LiveContext = createContext<LiveState | null>(null);

export function useLive(): LiveState {
  const v = useContext(LiveContext);
  if (!v) throw new Error("useLive outside LiveChecksProvider");
  return v;
}

function evaluate(values: unknown, prev: LiveState): LiveState {
  const t0 = performance.now();
  const parsed = parseLenient(values);
  const t1 = performance.now();
  let run = prev.run;
  let engineMs = prev.engineMs;
  let total = (prev.meanEngineMs ?? 0) * prev.runs;
  let runs = prev.runs;
  if (parsed.record) {
    run = runChecks(parsed.record);
    engineMs = performance.now() - t1;
    runs += 1;
    total += engineMs;
  }
  return {
    record: parsed.record ?? prev.record,
    run,
    issues: parsed.issues,
    omitted: parsed.omitted,
    pending: false,
    engineMs,
    parseMs: t1 - t0,
    runs,
    meanEngineMs: runs ? total / runs : null,
  };
}

const EMPTY: LiveState = {
  record: null,
  run: null,
  issues: [],
  omitted: [],
  pending: true,
  engineMs: null,
  parseMs: null,
  runs: 0,
  meanEngineMs: null,
};

export function LiveChecksProvider({ children }: { children: React.ReactNode }) {
  const { watch, getValues } = useFormContext();
  // The first run also happens on the server; its timing is left out so both renders agree.
  const [state, setState] = useState<LiveState>(() => ({ ...evaluate(getValues(), EMPTY), engineMs: null, parseMs: null, runs: 0, meanEngineMs: null }));
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  useEffect(() => {
    const sub = watch(() => {
      setState((s) => (s.pending ? s : { ...s, pending: true }));
      if (timer.current) clearTimeout(timer.current);
      timer.current = setTimeout(() => setState((s) => evaluate(getValues(), s)), DEBOUNCE_MS);
    });
    return () => {
      sub.unsubscribe();
      if (timer.current) clearTimeout(timer.current);
    };
  }, [watch, getValues]);
  return <LiveContext.Provider value={state}>{children}</LiveContext.Provider>;
}
