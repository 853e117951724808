import "server-only";
export { listProjectCorrections, listSubmissionCorrections, openCorrectionCount, type CorrectionView, type CorrectionsView } from "./list";
export { assignCorrection, reopenCorrection, resolveCorrection, type WorkedCorrection } from "./work";
export { correctionResponseSheet } from "./response-sheet";
