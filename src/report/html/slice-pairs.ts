import type { RuleTable } from '../../types.js';

/** Default number of input pairs offered as slice plots. */
export const MAX_SLICE_PAIRS = 6;

/** True when the rule's interval of input `i` is narrower than the input's domain. */
export function constrains(table: RuleTable, rule: number, i: number): boolean {
  const [lo, hi] = table.rules[rule]!.rule.box[i]!;
  const inp = table.inputs[i]!;
  return lo > inp.min || hi < inp.max;
}

/**
 * The informative input pairs for slice plots: the pairs that the rules constrain together most
 * often (both intervals narrower than the domain), ties broken by how often each input is
 * constrained on its own, then by input order. Pairs no rule constrains still fill the list
 * when there are fewer informative ones, so a table with one split still gets plots.
 * @param table the rule table (>= 2 inputs, else no pairs)
 * @param maxPairs how many pairs at most
 * @returns pairs [i, j] of input indices with i < j, most informative first
 */
export function slicePairs(table: RuleTable, maxPairs = MAX_SLICE_PAIRS): Array<[number, number]> {
  const d = table.inputs.length;
  const single = new Array<number>(d).fill(0);
  const joint = new Array<number>(d * d).fill(0);
  for (let r = 0; r < table.rules.length; r++) {
    const cut: number[] = [];
    for (let i = 0; i < d; i++) if (constrains(table, r, i)) cut.push(i);
    for (const i of cut) single[i]!++;
    for (let a = 0; a < cut.length; a++) for (let b = a + 1; b < cut.length; b++) joint[cut[a]! * d + cut[b]!]!++;
  }
  const pairs: Array<{ p: [number, number]; joint: number; single: number }> = [];
  for (let i = 0; i < d; i++) for (let j = i + 1; j < d; j++) pairs.push({ p: [i, j], joint: joint[i * d + j]!, single: single[i]! + single[j]! });
  pairs.sort((a, b) => b.joint - a.joint || b.single - a.single || a.p[0] - b.p[0] || a.p[1] - b.p[1]);
  return pairs.slice(0, Math.max(0, maxPairs)).map((x) => x.p);
}
