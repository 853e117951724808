/**
 * Reading one typed cell, shared by the CSV import and the library form so a
 * value is refused with the same words wherever it is typed. No papaparse here:
 * client forms import this file.
 */
const NUMBER = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

export type Read<T> = { ok: true; value: T } | { ok: false; message: string };

export function inUnit(words: string): string {
  return words ? `, in ${words}` : "";
}

export function readNumberCell(raw: string, unitWords: string): Read<number> {
  // A typographic minus (U+2212) comes out of word processors; it means the same sign.
  const s = raw.trim().replace(/^\u2212/, "-");
  if (NUMBER.test(s)) return { ok: true, value: Number(s) };
  if (/^[+-]?\d{1,3}(,\d{3})+(\.\d+)?$/.test(s) || /^[+-]?\d+,\d+$/.test(s)) {
    return { ok: false, message: `write the number with a decimal point and no thousands separators (e.g. 1500 or 49.5)${inUnit(unitWords)}` };
  }
  if (/^[+-]?(\d|\.\d)/.test(s)) return { ok: false, message: `write the number only${inUnit(unitWords)}` };
  return { ok: false, message: `must be a number${inUnit(unitWords)}` };
}

