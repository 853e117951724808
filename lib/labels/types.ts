/**
 * The label contract the check engine produces (one entry per label the
 * system needs). Kept structurally identical to the engine's type so either
 * can be passed where the other is expected.
 */
export type SignalWord = "DANGER" | "WARNING" | "CAUTION" | "NOTICE";

export interface LabelRequirement {
  id: string;
  /** Code section that calls for the label, in the jurisdiction's edition, e.g. "NEC 2023 690.7(D)". */
  codeRef: string;
  signalWord: SignalWord;
  title: string;
  /** Body lines with the computed values already substituted. */
  lines: string[];
  /** Where the label goes, in words an installer can follow. */
  location: string;
  equipmentTag?: string;
}
