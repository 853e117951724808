import "server-only";
export { sendForReview, type SendOptions, type SentForReview } from "./send";
export { decideReview, type DecideOptions, type Decided } from "./decide";
export { renderStampedPacketAgain, type RestampOptions } from "./restamp";
export { getOwnLicence, saveOwnLicence, type LicenceView } from "./licence";
export { uploadStampImage, STAMP_MIN_PX, UploadRefusedError } from "./stamp";
export { listRevisionReviews, listProjectReviews, type ReviewEntry, type ReviewNoteView } from "./history";
export { getReviewWorkspace, type ReviewWorkspace, type ReviewCheck } from "./view";
export { PACKET_SHEETS, licenceStanding, type LicenceStanding, type StampView } from "./shared";
