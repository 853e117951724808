/**
 * The label contract is the engine's: one entry per label the system needs,
 * computed values substituted, `missing` naming the fields whose absence left
 * a blank on the label.
 */
export type { LabelRequirement, SignalWord } from "../compliance/labels";
