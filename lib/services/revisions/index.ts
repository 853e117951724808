import "server-only";
export { preflightPacket, type Preflight, type PreflightCheck } from "./preflight";
export { startRevision, type StartedRevision, type StartOptions } from "./start";
export { generateRevisionArtifacts, failRevision } from "./generate";
export { listProjectRevisions, getRevision } from "./list";
export { getRevisionFile, packetFileName, type PacketDownload } from "./files";
export { PROGRESS_STEPS, PROGRESS_STEP_LABELS, type ProgressStep, type RevisionView } from "./view";
