"use client";

/**
 * The one-line diagram in the page: the same layout and scene the packet
 * draws, as inline SVG that scales to its container. Boxes and circuits are
 * keyboard-focusable buttons when the caller wants selection.
 */
import { useEffect, useMemo, useRef, useState, type KeyboardEvent, type ReactNode } from "react";
import { runChecks } from "@/lib/compliance";
import { failuresOf, layoutOneLine, type OneLineLayout } from "@/lib/diagram/layout";
import { PALETTE, buildScene, type Ink, type Prim, type SceneGroup } from "@/lib/diagram/scene";
import { DIAGRAM_FONT_FAMILY } from "@/lib/diagram/svg";
import type { ProjectRecord } from "@/lib/schemas/project-record";

export interface OneLineDiagramProps {
  record: ProjectRecord;
  /** Called with the equipment, array or circuit tag a user chooses. */
  onSelect?: (tag: string) => void;
  /** Tag to show as selected (e.g. the row being edited). */
  selectedTag?: string;
  title?: string;
  className?: string;
}

type State =
  | { status: "loading"; layout: OneLineLayout | null }
  | { status: "ready"; layout: OneLineLayout }
  | { status: "error"; layout: OneLineLayout | null; message: string };

/** Waits this long after the last change before laying out again, so typing stays smooth. */
const RELAYOUT_DELAY_MS = 150;

/** Only the parts of the record that the drawing shows; other edits do not redraw it. */
function drawnPart(record: ProjectRecord): string {
  return JSON.stringify([record.equipment, record.arrays, record.circuits]);
}

export function useOneLineLayout(record: ProjectRecord): State {
  // Failing checks are marked on the drawing; the engine is pure and fast enough to run on every edit.
  const failures = useMemo(() => {
    try {
      return failuresOf(runChecks(record).results);
    } catch {
      return [];
    }
  }, [record]);
  const key = drawnPart(record) + JSON.stringify(failures);
  const latestFailures = useRef(failures);
  latestFailures.current = failures;
  // The latest record, read when the delay runs out; `key` decides when that is.
  const latest = useRef(record);
  latest.current = record;
  const [state, setState] = useState<State>({ status: "loading", layout: null });
  useEffect(() => {
    let cancelled = false;
    setState((s) => ({ status: "loading", layout: s.layout }));
    const timer = setTimeout(() => {
      layoutOneLine(latest.current, { failures: latestFailures.current })
        .then((layout) => {
          if (!cancelled) setState({ status: "ready", layout });
        })
        .catch((err: unknown) => {
          if (!cancelled) {
            setState((s) => ({
              status: "error",
              layout: s.layout,
              message: err instanceof Error ? err.message : String(err),
            }));
          }
        });
    }, RELAYOUT_DELAY_MS);
    return () => {
      cancelled = true;
      clearTimeout(timer);
    };
  }, [key]);
  return state;
}

const paint = (ink: Ink | undefined) => (ink ? PALETTE[ink] : "none");

function PrimElement({ p }: { p: Prim }) {
  switch (p.type) {
    case "rect":
      return (
        <rect
          x={p.x}
          y={p.y}
          width={p.width}
          height={p.height}
          fill={paint(p.fill)}
          stroke={paint(p.stroke)}
          strokeWidth={p.stroke ? (p.lineWidth ?? 1) : undefined}
          strokeDasharray={p.dash?.join(" ")}
        />
      );
    case "path":
      return (
        <path
          d={p.d}
          fill={paint(p.fill)}
          stroke={paint(p.stroke)}
          strokeWidth={p.stroke ? (p.lineWidth ?? 1) : undefined}
          strokeDasharray={p.dash?.join(" ")}
        />
      );
    case "text":
      return (
        <text
          xmlSpace="preserve"
          x={p.x}
          y={p.y}
          fontSize={p.size}
          fontWeight={p.weight === "bold" ? 700 : undefined}
          textAnchor={p.anchor && p.anchor !== "start" ? p.anchor : undefined}
          fill={paint(p.colour)}
        >
          {p.text}
        </text>
      );
  }
}

/** Outline drawn around the chosen box or circuit: slate, dashed, outside the drafting palette on purpose. */
function SelectionRing({ group, layout }: { group: SceneGroup; layout: OneLineLayout }) {
  const ring = { fill: "none", stroke: "#2f3e52", strokeWidth: 1.5, strokeDasharray: "4 2" } as const;
  if (group.role === "node") {
    const n = layout.nodes.find((x) => x.id === group.id);
    if (!n) return null;
    return <rect x={n.x - 4} y={n.y - 4} width={n.width + 8} height={n.height + 8} {...ring} />;
  }
  const e = layout.edges.find((x) => x.id === group.id);
  if (!e) return null;
  const b = e.calloutBox;
  return (
    <>
      <path d={e.points.map((p, i) => `${i ? "L" : "M"} ${p.x} ${p.y}`).join(" ")} fill="none" stroke="#2f3e52" strokeOpacity={0.35} strokeWidth={5} />
      <rect x={b.x - 2} y={b.y - 2} width={b.width + 4} height={b.height + 4} {...ring} />
    </>
  );
}

export function OneLineDiagram({ record, onSelect, selectedTag, title, className }: OneLineDiagramProps) {
  const state = useOneLineLayout(record);
  const layout = state.layout;
  const heading = title ?? `One-line diagram, ${record.name}`;

  if (!layout) {
    if (state.status === "error") {
      return (
        <div role="alert" className={`sheet border-l-4 border-l-signal px-4 py-4 text-sm ${className ?? ""}`}>
          <p className="font-semibold">The one-line diagram could not be drawn</p>
          <p className="mt-1 text-ink-soft">{state.message}</p>
        </div>
      );
    }
    return (
      <div role="status" aria-live="polite" className={`sheet px-4 py-8 text-center text-sm text-ink-soft ${className ?? ""}`}>
        Drawing the one-line diagram…
      </div>
    );
  }

  return (
    <OneLineDiagramView
      layout={layout}
      heading={heading}
      onSelect={onSelect}
      selectedTag={selectedTag}
      className={className}
      note={
        state.status === "loading" ? (
          <figcaption role="status" aria-live="polite" className="mt-1 text-xs text-ink-faint">
            Updating the diagram…
          </figcaption>
        ) : state.status === "error" ? (
          <figcaption role="alert" className="mt-1 text-xs text-signal">
            The diagram shows the last good layout; the latest change could not be drawn: {state.message}
          </figcaption>
        ) : null
      }
    />
  );
}

export interface OneLineDiagramViewProps {
  layout: OneLineLayout;
  heading: string;
  onSelect?: (tag: string) => void;
  selectedTag?: string;
  className?: string;
  note?: ReactNode;
}

/** Draws a computed layout; no effects, so it also renders on the server and in tests. */
export function OneLineDiagramView({ layout, heading, onSelect, selectedTag, className, note }: OneLineDiagramViewProps) {
  const scene = useMemo(() => buildScene(layout), [layout]);
  const selectable = (g: SceneGroup) => onSelect !== undefined && g.tag !== undefined && (g.role === "node" || g.role === "edge");
  const choose = (g: SceneGroup) => {
    if (g.tag !== undefined) onSelect?.(g.tag);
  };
  const onKey = (g: SceneGroup) => (ev: KeyboardEvent<SVGGElement>) => {
    if (ev.key === "Enter" || ev.key === " ") {
      ev.preventDefault();
      choose(g);
    }
  };
  const selected = scene.groups.find((g) => g.tag !== undefined && g.tag === selectedTag && g.role !== "legend");

  return (
    <figure className={className} style={{ margin: 0 }}>
      <svg
        viewBox={`0 0 ${scene.width} ${scene.height}`}
        width="100%"
        role="img"
        aria-label={heading}
        fontFamily={DIAGRAM_FONT_FAMILY}
        strokeLinecap="square"
        style={{ display: "block", height: "auto", maxWidth: "100%", fontVariantNumeric: "tabular-nums" }}
      >
        <title>{heading}</title>
        <rect x={0} y={0} width={scene.width} height={scene.height} fill={PALETTE.paper} />
        {selected ? <SelectionRing group={selected} layout={layout} /> : null}
        {scene.groups.map((g) => {
          const interactive = selectable(g);
          return (
            <g
              key={g.id}
              data-tag={g.tag}
              className={`one-line-${g.role}${g.trouble ? " one-line-trouble" : ""}`}
              {...(interactive
                ? {
                    role: "button",
                    tabIndex: 0,
                    "aria-label": g.label,
                    "aria-pressed": g === selected,
                    onClick: () => choose(g),
                    onKeyDown: onKey(g),
                    style: { cursor: "pointer" },
                  }
                : {})}
            >
              <title>{g.label}</title>
              {g.prims.map((p, i) => (
                <PrimElement key={i} p={p} />
              ))}
            </g>
          );
        })}
      </svg>
      {note}
    </figure>
  );
}
