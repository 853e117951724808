import fc from "fast-check";

/**
 * Bodies nobody's form would send: wrong types in every field, keys named
 * after Object's own properties, strings of every plane of Unicode, long
 * strings, nesting deeper than any record, and text that is not JSON at all.
 */

/** Keys the app reads somewhere, keys that reach Object.prototype, and any key at all. */
export const hostileKey = (known: readonly string[]) =>
  fc.oneof(
    { weight: 3, arbitrary: fc.constantFrom(...known) },
    { weight: 2, arbitrary: fc.constantFrom("__proto__", "constructor", "prototype", "toString", "valueOf", "hasOwnProperty", "__defineGetter__", "then") },
    { weight: 1, arbitrary: fc.string({ unit: "grapheme", maxLength: 20 }) },
  );

const leaf = fc.oneof(
  fc.string({ unit: "binary", maxLength: 40 }),
  fc.string({ unit: "grapheme", maxLength: 40 }),
  fc.string({ minLength: 5_000, maxLength: 60_000 }),
  fc.integer(),
  fc.double(),
  fc.constantFrom(0, -1, 1e308, -1e308, Number.MAX_SAFE_INTEGER + 2),
  fc.boolean(),
  fc.constant(null),
  fc.constantFrom("", " ", "\u0000", "\u202e", "null", "undefined", "NaN", "2026-02-30", "../../etc/passwd", "<script>alert(1)</script>", "=HYPERLINK(\"x\")"),
);

export const hostileValue = (known: readonly string[]) =>
  fc.letrec<{ value: unknown }>((tie) => ({
    value: fc.oneof(
      { depthSize: "small", withCrossShrink: true },
      leaf,
      fc.array(tie("value"), { maxLength: 6 }),
      fc.dictionary(hostileKey(known), tie("value"), { maxKeys: 6 }),
    ),
  })).value;

/** A JSON text: an object with the route's own keys holding anything, any JSON value, or a deep nest. */
export const hostileJsonText = (known: readonly string[]) =>
  fc.oneof(
    { weight: 5, arbitrary: fc.dictionary(hostileKey(known), hostileValue(known), { maxKeys: 8 }).map((o) => JSON.stringify(o)) },
    { weight: 2, arbitrary: hostileValue(known).map((v) => JSON.stringify(v) ?? "null") },
    { weight: 1, arbitrary: fc.integer({ min: 50, max: 5_000 }).map((depth) => "[".repeat(depth) + "]".repeat(depth)) },
    { weight: 1, arbitrary: fc.integer({ min: 50, max: 5_000 }).map((depth) => '{"a":'.repeat(depth) + "1" + "}".repeat(depth)) },
    { weight: 1, arbitrary: fc.constantFrom(...known).chain((k) => fc.integer({ min: 50, max: 3_000 }).map((depth) => `{${JSON.stringify(k)}:${"[".repeat(depth)}${"]".repeat(depth)}}`)) },
    // Not JSON: truncated, trailing garbage, bare words, a byte-order mark, lone surrogates.
    { weight: 2, arbitrary: fc.string({ unit: "binary", maxLength: 200 }) },
    { weight: 1, arbitrary: fc.constantFrom("{", '{"a":', "[1,2", "\ufeff{}", '{"a":1}x', "NaN", '"\ud800"', "{'a':1}", "") },
  );

/** Form fields as a browser could post them to an action: the action's names and others, with any text. */
export const hostileFormFields = (known: readonly string[]) =>
  fc.dictionary(
    fc.oneof({ weight: 4, arbitrary: fc.constantFrom(...known) }, { weight: 1, arbitrary: fc.string({ maxLength: 12 }) }),
    fc.oneof(fc.string({ unit: "binary", maxLength: 60 }), fc.string({ minLength: 5_000, maxLength: 60_000 }), leaf.map((v) => String(v))),
    { maxKeys: 10 },
  );

/** File bytes: random, or with the start of a real format's signature and nonsense after it. */
export const hostileFileBytes = fc.oneof(
  fc.uint8Array({ maxLength: 4_096 }),
  fc.uint8Array({ maxLength: 512 }).map((rest) => new Uint8Array([0x25, 0x50, 0x44, 0x46, 0x2d, 0x31, 0x2e, 0x37, 0x0a, ...rest])),
  fc.uint8Array({ maxLength: 512 }).map((rest) => new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, ...rest])),
  fc.uint8Array({ maxLength: 512 }).map((rest) => new Uint8Array([0xff, 0xd8, 0xff, 0xe0, ...rest])),
);

export const claimedMime = fc.constantFrom("application/pdf", "image/png", "image/jpeg", "text/csv", "application/octet-stream", "text/html", "");
