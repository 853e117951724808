export type { LabelRequirement, SignalWord } from "./types";
export { labelArtwork, HEADER_STYLES, SAFETY_COLOURS, DEFAULT_LETTER_HEIGHTS, RAPID_SHUTDOWN_LETTER_HEIGHTS } from "./artwork";
export type { LabelArtwork, HeaderStyle, ArtworkOptions } from "./artwork";
export { drawLabel, layoutLabel, fitLabel, drawLabelLayout } from "./draw";
export { renderLabelSheet, renderLabelSheetPdf, LABEL_STOCKS } from "./sheet";
export type { LabelStockName, LabelSheetOptions } from "./sheet";
