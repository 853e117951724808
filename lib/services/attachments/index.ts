import "server-only";
export { uploadAttachment, uploadFieldsSchema, cleanFileName, type UploadInput, type UploadResult } from "./upload";
export { listProjectAttachments } from "./list";
export { getAttachment, getAttachmentFile, getAttachmentFiles } from "./get-file";
export { deleteAttachment } from "./delete";
export { linkAttachmentToEquipment } from "./link-equipment";
export type { AttachmentView } from "./view";
