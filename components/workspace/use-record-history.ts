"use client";

/**
 * Undo and redo over the whole record (Ctrl+Z, Ctrl+Shift+Z or Ctrl+Y): a
 * step is whatever the designer changed before pausing or moving to another
 * control, in any cell, so
 * undo puts back the last change to the design rather than the last
 * character typed in whichever cell has focus.
 */
import { useCallback, useEffect, useRef, useState } from "react";
import type { FieldValues, UseFormReturn } from "react-hook-form";

/** A pause this long closes a step: typing "150" is one step, not three. */
const STEP_PAUSE_MS = 400;
const MAX_STEPS = 200;

export function useRecordHistory<T extends FieldValues>(form: UseFormReturn<T, unknown, unknown>, initial: unknown) {
  const history = useRef({ past: [] as string[], future: [] as string[], current: JSON.stringify(initial) });
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const restoring = useRef(false);
  const [counts, setCounts] = useState({ undo: 0, redo: 0 });
  const publish = () => setCounts({ undo: history.current.past.length, redo: history.current.future.length });

  const record = useCallback(() => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
    const now = JSON.stringify(form.getValues());
    const h = history.current;
    if (now === h.current) return;
    h.past.push(h.current);
    if (h.past.length > MAX_STEPS) h.past.shift();
    h.current = now;
    h.future = [];
    publish();
  }, [form]);

  useEffect(() => {
    const sub = form.watch(() => {
      if (restoring.current) return;
      if (timer.current) clearTimeout(timer.current);
      timer.current = setTimeout(record, STEP_PAUSE_MS);
    });
    // Moving to another control or pressing a button also closes the step, so a quick rename followed by a delete
    // are two steps to undo, however fast the designer works.
    const closeStep = () => {
      if (timer.current) record();
    };
    window.addEventListener("pointerdown", closeStep, true);
    window.addEventListener("focusin", closeStep, true);
    return () => {
      sub.unsubscribe();
      window.removeEventListener("pointerdown", closeStep, true);
      window.removeEventListener("focusin", closeStep, true);
      if (timer.current) clearTimeout(timer.current);
    };
  }, [form, record]);

  const restore = useCallback(
    (json: string) => {
      restoring.current = true;
      form.reset(JSON.parse(json) as T, { keepDefaultValues: true });
      restoring.current = false;
      void form.trigger();
      publish();
    },
    [form],
  );

  const undo = useCallback(() => {
    record();
    const h = history.current;
    const previous = h.past.pop();
    if (previous === undefined) return;
    h.future.push(h.current);
    h.current = previous;
    restore(previous);
  }, [record, restore]);

  const redo = useCallback(() => {
    record();
    const h = history.current;
    const next = h.future.pop();
    if (next === undefined) return;
    h.past.push(h.current);
    h.current = next;
    restore(next);
  }, [record, restore]);

  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (!(e.ctrlKey || e.metaKey) || e.altKey) return;
      const key = e.key.toLowerCase();
      const isUndo = key === "z" && !e.shiftKey;
      const isRedo = (key === "z" && e.shiftKey) || key === "y";
      if (!isUndo && !isRedo) return;
      // Only inside the editor: other text boxes on the page keep the browser's own undo.
      const target = e.target as Element | null;
      if (target && target !== document.body && !target.closest("form[aria-label='Project design']")) return;
      e.preventDefault();
      if (isUndo) undo();
      else redo();
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [undo, redo]);

  return { undo, redo, canUndo: counts.undo > 0, canRedo: counts.redo > 0 };
}
