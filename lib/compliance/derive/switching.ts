/**
 * Which switching devices stand on a circuit, and which circuits meet at a
 * device: the disconnects check and the label list both need them, so a
 * disconnect found for one is found for the other.
 */
import type { Circuit } from "../../schemas/project-record";
import type { CheckContext, Indexed } from "../context";

const SWITCHING = new Set(["disconnect", "breaker"]);

/** Switching devices on a circuit: its disconnects, a breaker as its overcurrent device, or a disconnect at either end. */
export function switchingDevicesOn(ctx: CheckContext, c: Circuit): string[] {
  const tags = new Set<string>();
  for (const tag of [...c.disconnectTags, ...(c.ocpdTag ? [c.ocpdTag] : []), c.fromTag, c.toTag]) {
    const e = ctx.equipment.get(tag);
    if (e && SWITCHING.has(e.item.kind)) tags.add(tag);
  }
  return [...tags];
}

/** Circuits at a device, and one hop further through a bus bar (a battery bank landed on a bus). */
export function circuitsNear(ctx: CheckContext, tag: string): Indexed<Circuit>[] {
  const direct = ctx.circuitsByEndpoint.get(tag) ?? [];
  const out = [...direct];
  for (const c of direct) {
    const other = c.item.fromTag === tag ? c.item.toTag : c.item.fromTag;
    if (ctx.equipment.get(other)?.item.kind === "busbar") {
      for (const c2 of ctx.circuitsByEndpoint.get(other) ?? []) if (!out.includes(c2)) out.push(c2);
    }
  }
  return out;
}
