import type { LabelRequirement, SignalWord } from "./types";

/**
 * How a required label prints: ANSI Z535.4 signal-word panel over a message
 * panel. Colours approximate the ANSI Z535.1 safety colours in sRGB (from
 * memory); a jurisdiction may require other colours or reflective stock.
 */
export interface Rgb {
  r: number;
  g: number;
  b: number;
}

const hex = (h: string): Rgb => ({
  r: parseInt(h.slice(1, 3), 16) / 255,
  g: parseInt(h.slice(3, 5), 16) / 255,
  b: parseInt(h.slice(5, 7), 16) / 255,
});

export const SAFETY_COLOURS = {
  red: hex("#C8102E"),
  orange: hex("#FF8200"),
  yellow: hex("#FFD100"),
  blue: hex("#0072CE"),
  black: hex("#000000"),
  white: hex("#FFFFFF"),
} as const;

export interface HeaderStyle {
  background: Rgb;
  text: Rgb;
  /** The safety alert symbol (triangle with exclamation mark) precedes DANGER, WARNING and CAUTION; never NOTICE. */
  alertSymbol: { triangle: Rgb; mark: Rgb } | null;
}

export const HEADER_STYLES: Record<SignalWord, HeaderStyle> = {
  DANGER: { background: SAFETY_COLOURS.red, text: SAFETY_COLOURS.white, alertSymbol: { triangle: SAFETY_COLOURS.white, mark: SAFETY_COLOURS.red } },
  WARNING: { background: SAFETY_COLOURS.orange, text: SAFETY_COLOURS.black, alertSymbol: { triangle: SAFETY_COLOURS.black, mark: SAFETY_COLOURS.orange } },
  CAUTION: { background: SAFETY_COLOURS.yellow, text: SAFETY_COLOURS.black, alertSymbol: { triangle: SAFETY_COLOURS.black, mark: SAFETY_COLOURS.yellow } },
  NOTICE: { background: SAFETY_COLOURS.blue, text: SAFETY_COLOURS.white, alertSymbol: null },
};

export interface LabelArtwork {
  id: string;
  signalWord: SignalWord;
  header: HeaderStyle;
  title: string;
  lines: string[];
  codeRef: string;
  location: string;
  equipmentTag?: string;
  /** Minimum printed letter (cap) heights. */
  minLetterHeightIn: { signalWord: number; text: number };
  /** Width the label is laid out for, before any scaling to a box or stock. */
  widthIn: number;
}

export interface LetterHeightRule {
  signalWordIn: number;
  textIn: number;
}

/**
 * 110.21(B) asks for legible, permanent markings without a size; 1/4 in signal
 * word and 1/8 in text is common practice. The rapid-shutdown sign has sizes
 * of its own: 3/8 in title and 3/16 in text (NEC 2017/2020 690.56(C)(1),
 * NEC 2023 690.12(D)).
 */
export const DEFAULT_LETTER_HEIGHTS: LetterHeightRule = { signalWordIn: 0.25, textIn: 0.125 };
export const RAPID_SHUTDOWN_LETTER_HEIGHTS: LetterHeightRule = { signalWordIn: 0.375, textIn: 0.1875 };

function isRapidShutdownSign(req: LabelRequirement): boolean {
  return /690\.56\(C\)|690\.12\(D\)/.test(req.codeRef) || /RAPID SHUTDOWN/i.test(req.title);
}

export interface ArtworkOptions {
  widthIn?: number;
  /** A jurisdiction's label rule, applied where it asks for more than the default. */
  minLetterHeights?: Partial<LetterHeightRule>;
}

export function labelArtwork(req: LabelRequirement, options: ArtworkOptions = {}): LabelArtwork {
  const base = isRapidShutdownSign(req) ? RAPID_SHUTDOWN_LETTER_HEIGHTS : DEFAULT_LETTER_HEIGHTS;
  const signalWordIn = Math.max(base.signalWordIn, options.minLetterHeights?.signalWordIn ?? 0);
  const textIn = Math.max(base.textIn, options.minLetterHeights?.textIn ?? 0);
  return {
    id: req.id,
    signalWord: req.signalWord,
    header: HEADER_STYLES[req.signalWord],
    title: req.title.toUpperCase(),
    lines: req.lines,
    codeRef: req.codeRef,
    location: req.location,
    equipmentTag: req.equipmentTag,
    minLetterHeightIn: { signalWord: signalWordIn, text: textIn },
    widthIn: options.widthIn ?? 4,
  };
}
