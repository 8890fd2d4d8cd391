// Bracket records read back from text (what `halfplus cut --json` wrote: one JSON object, or JSON
// lines), each checked for shape by parseBracketRecord and kept with where it was found.

import { parseJsonRecords } from "../../graph/record/json-records.js";
import type { BracketRecord } from "./record.js";
import { parseBracketRecord } from "./verify.js";

export interface ReadBracketRecord {
  record: BracketRecord;
  /** The file, or `file:line` for JSON lines. */
  where: string;
  /** 1-based position among the records of the text. */
  position: number;
}

/** Every bracket record in `text`; anything else is bad input naming `where` (and the line). */
export function readBracketRecords(text: string, where: string): ReadBracketRecord[] {
  return parseJsonRecords(text, where).map((r) => ({ record: parseBracketRecord(r.value, r.where), where: r.where, position: r.position }));
}
