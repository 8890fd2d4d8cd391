// Plain text → TeX for labels in the pgfplots export: the special characters escaped and the
// Unicode math symbols our labels use spelled as TeX, so the file compiles under pdflatex too.

const SYMBOLS: Record<string, string> = {
  "·": "$\\cdot$",
  "√": "$\\surd$",
  "−": "$-$",
  "≤": "$\\le$",
  "≥": "$\\ge$",
  "≈": "$\\approx$",
  "×": "$\\times$",
  "±": "$\\pm$",
  "∈": "$\\in$",
  "–": "--",
  "—": "---",
  "α": "$\\alpha$",
  "β": "$\\beta$",
  "γ": "$\\gamma$",
  "δ": "$\\delta$",
  "ε": "$\\varepsilon$",
  "θ": "$\\theta$",
  "λ": "$\\lambda$",
  "σ": "$\\sigma$",
  "χ": "$\\chi$",
  "²": "$^2$",
  "³": "$^3$",
  "½": "$\\frac12$",
  "\u00a0": "~",
};

/** Text for TeX: special characters escaped, the common math symbols spelled out. */
export function texEscape(s: string): string {
  return s.replace(/[\\{}$&#^_%~]|[^\x00-\x7f]/g, (c) => {
    switch (c) {
      case "\\":
        return "\\textbackslash{}";
      case "~":
        return "\\textasciitilde{}";
      case "^":
        return "\\textasciicircum{}";
      case "{":
      case "}":
      case "$":
      case "&":
      case "#":
      case "_":
      case "%":
        return "\\" + c;
      default:
        // Other non-ASCII characters (accented letters) are left to the document's input encoding.
        return SYMBOLS[c] ?? c;
    }
  });
}
