// Result records as text: one JSON object (possibly pretty-printed), or JSON lines as the CLI's
// --json writes them. Read strictly (src/limits/strict-json.ts: a duplicate key or trailing
// garbage is bad input, never something two parsers could read differently); each value comes
// back with where it was found, for one-line errors.

import { InputError } from "../../errors.js";
import { parseJsonSequence } from "../../limits/strict-json.js";

export interface JsonRecordText {
  value: unknown;
  /** Where the record starts in messages: `where:line (record k)`. */
  where: string;
  /** 1-based position of the record in the text. */
  position: number;
}

export function parseJsonRecords(text: string, where: string): JsonRecordText[] {
  const values = parseJsonSequence(text, where);
  if (values.length === 0) throw new InputError(`${where}: holds no record`);
  return values.map((v, k) => ({ value: v.value, where: `${where}:${v.line} (record ${k + 1})`, position: k + 1 }));
}
