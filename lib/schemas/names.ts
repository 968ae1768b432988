/**
 * Names people give fuels, plants, studies and scenarios: normalised to Unicode NFC (so "é" typed two
 * ways is one name), trimmed, and refused when they hold control characters, bidirectional overrides
 * or invisible characters that could make two different names look the same (Unicode Technical
 * Report #36, Unicode Security Considerations).
 */
import { z } from "zod";

/** C0/C1 controls, bidirectional embeddings/overrides/isolates, zero-width and other invisible format characters. */
// biome-ignore lint/suspicious/noControlCharactersInRegex: matching control characters is this pattern's purpose
const FORBIDDEN = /[\u0000-\u001f\u007f-\u009f\u200b-\u200f\u202a-\u202e\u2060-\u2064\u2066-\u2069\ufeff]/u;

export function nameSchema(max: number, emptyMessage: string) {
  return z
    .string({ error: "must be text" })
    .transform((s) => s.normalize("NFC").trim())
    .pipe(
      z
        .string()
        .min(1, emptyMessage)
        .max(max, `must be ≤ ${max} characters`)
        .refine((s) => !FORBIDDEN.test(s), { message: "must not contain control, direction-override or invisible characters" }),
    );
}

/**
 * A key for spotting look-alike names: case folded, compatibility-normalised (NFKC: full-width and
 * ligature forms fold to their plain letters), white space collapsed.
 */
export function lookAlikeKey(name: string): string {
  return name.normalize("NFKC").toLowerCase().replace(/\s+/g, " ").trim();
}
