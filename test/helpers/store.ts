// Reading a results store whole, for tests that compare stores row by row.
import type { StoredRow } from "../../src/experiment/columns.js";
import { openStore } from "../../src/experiment/sqlite-store.js";

/** Every row of the store at `path`, in export order. */
export function allRows(path: string): StoredRow[] {
  const st = openStore(path, { readonly: true });
  try {
    return [...st.rows()];
  } finally {
    st.close();
  }
}
