/**
 * Provenance as a careful lab writes it. The engine and reference tables mark, for their authors,
 * which clause numbers and values were transcribed from memory or from secondary references
 * ("…; from memory)", "are from memory: verify before release"). A filing's reader needs the same
 * caution in the trade's words: the clause is named, and the reader is told to check it against
 * the current edition. Display only: the data keeps its own wording.
 */

const CHECK = 'check against the current edition';
const CHECK_TEXT = 'check against the published text';

const REWRITES: [RegExp, string][] = [
  [/\s+as recalled\b/gi, ''],
  [/marked “from memory”/g, `marked “${CHECK}”`],
  [/\(from memory;\s*/gi, '('],
  // "… from memory (X): verify before release." — the caution follows the clause it names.
  [/\):\s*verify before (release|a filing)/gi, ')'],
  [/\b(values|wording|clause numbers?) from memory,\s*/gi, '$1, '],
  // "… are from memory: verify before release." → the same caution, addressed to the reader.
  [/\s+(are|is) from memory:\s*verify (before release|against [^.;)]*)/gi, ` $1 to be checked against the current edition`],
  [/\s+(are|is) (largely )?from memory\b/gi, ' $1 to be checked against the current edition'],
  [/\blargely from memory\b/gi, 'to be checked against the current edition'],
  // "H from memory (ICNIRP 1998 Table 6)" → "H (ICNIRP 1998 Table 6; check …)"
  [/\s+from memory\s+\(([^()]*)\)/g, ` ($1; ${CHECK})`],
  // … and when that parenthesis has its own remark (nested clause numbers), the remark there says it.
  [/\s+from memory(?=\s+\()/g, ''],
  // "(from memory: FCC KDB 643646 D01)" → "(FCC KDB 643646 D01; check …)"
  [/\(from memory:\s*([^)]*)\)/gi, `($1; ${CHECK})`],
  // "(from memory, no single published source; …" → "(no single published source; …"
  [/\(from memory,\s*/gi, '('],
  // A whole parenthesis that only says so: "(from memory)", "(clause numbers from memory)", "(chapter from memory)".
  [/\s*\((?:[a-z ]+ )?from memory(?: [A-Z])?\)/g, `; ${CHECK}`],
  // At the end of a parenthesis or clause list: "…; from memory)", "…, from memory)", "… — from memory)".
  [/\s*[;,—–]\s*(?:[a-z ]+ )?from memory(?: [A-Z])?(?=\s*[).;]|\s*$)/g, `; ${CHECK}`],
  [/\s*[;,]\s*from memory\b/gi, `; ${CHECK}`],
  [/\bverify before release\b/gi, CHECK],
  // Secondary references: said as a lab says it.
  [/\btranscribed from secondary sources?\b/gi, `as reproduced in secondary references; ${CHECK_TEXT}`],
  [/\s*\((?:from )?(?:a )?secondary source\)/gi, ` (${CHECK_TEXT})`],
  [/[:;,]\s*secondary source\b/gi, `; ${CHECK_TEXT}`],
  [/\bconfirmed from a secondary source\b/gi, `confirmed in a secondary reference; ${CHECK_TEXT}`],
  [/\bfrom a secondary source\b/gi, 'from a secondary reference'],
  [/\bsecondary sources?\b/gi, 'secondary references'],
  // Anything left that still says "from memory".
  [/\bfrom memory\b/gi, `(${CHECK})`],
];

/** The text with every "from memory" / "secondary source" remark said for the filing's reader. */
export function sourceWords(text: string): string {
  let out = text;
  for (const [pattern, replacement] of REWRITES) out = out.replace(pattern, replacement);
  return out
    .replace(/\(\s*;\s*/g, '(')
    .replace(/;\s*;/g, ';')
    .replace(new RegExp(`(; ${CHECK})+`, 'g'), `; ${CHECK}`)
    .replace(/\s{2,}/g, ' ')
    .replace(/^;\s*/, '')
    .trim();
}
