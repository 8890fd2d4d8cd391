// The command line resolves family specs through src/families/family-loaders.ts, which loads only
// the families a spec names. Reference: the registry (src/families/registry.ts), which imports
// every family: the table must name the same families, alias for alias, load the same definitions,
// and give the same graphs, specs, notes and errors (common practice, no source).
import { describe, expect, it } from "vitest";
import { isFamilyName, loadFamilyDefinition, loadFamilyWithInfo, loadableFamilyNames } from "../src/families/family-loaders.js";
import { familyWithInfo, getFamily, listFamilies } from "../src/families/registry.js";
import { InputError } from "../src/errors.js";
import { edgeStrings } from "./helpers/graphs.js";

describe("family loaders", () => {
  it("name every family and alias of the registry, and load the registry's own definition for each", async () => {
    const names = listFamilies().flatMap((d) => [d.name, ...(d.aliases ?? [])]);
    expect(names.length).toBeGreaterThan(30);
    expect([...loadableFamilyNames()].sort()).toEqual([...names].sort());
    for (const name of names) {
      expect(isFamilyName(name)).toBe(true);
      expect(await loadFamilyDefinition(name), name).toBe(getFamily(name));
    }
    expect(isFamilyName("regular")).toBe(false);
  });

  it("give the registry's graph, spec and notes for plain, aliased, random and nested specs", async () => {
    const specs = [
      "petersen", "kneser:n=7,k=3", "polarity:q=5", "gnp:n=30,p=0.2", "gnp:n=30,p=0.2,seed=4", "generalised-petersen:n=7,k=2", "cayley-zn:n=11,s=1+3",
      "blow-up:of=[kneser:n=5,k=2],t=2", "disjoint-union:of=[petersen]+[cycle:n=5]", "complement:of=[blow-up:of=[cycle:n=5],t=2]", "delete-random-edges:of=[petersen],p=0.3,seed=2",
    ];
    let compared = 0;
    for (const spec of specs) {
      const a = familyWithInfo(spec), b = await loadFamilyWithInfo(spec);
      expect(b.spec, spec).toBe(a.spec);
      expect(b.notes, spec).toEqual(a.notes);
      expect(b.graphSeed, spec).toBe(a.graphSeed);
      expect(edgeStrings(b.graph), spec).toEqual(edgeStrings(a.graph));
      compared++;
    }
    expect(compared).toBe(specs.length);
  });

  it("refuse bad specs with the registry's one-line message", async () => {
    const bad = ["nosuch", "regular:n=10,d=3", "kneser:n=5,k=2,z=1", "blow-up:of=[nosuch],t=2", "blow-up:of=[kneser:n=5],t=2,q=1", "disjoint-union:of=[petersen]+[union:of=[petersen]]"];
    for (const spec of bad) {
      let expected = "";
      try {
        familyWithInfo(spec);
      } catch (e) {
        expect(e).toBeInstanceOf(InputError);
        expected = (e as Error).message;
      }
      expect(expected, spec).not.toBe("");
      await expect(loadFamilyWithInfo(spec), spec).rejects.toThrow(expected);
    }
  });
});
