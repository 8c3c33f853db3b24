import { UsageError } from '../errors.js';
import type { DiffResult, RegressionVerdict } from './diff-result.js';

/** One regression gate of `specula diff --fail-on` (docs/checking.md, "Gates"). */
export type Gate =
  | { readonly kind: 'verdict'; readonly spec: string; readonly verdict: RegressionVerdict }
  | { readonly kind: 'refuted'; readonly spec: string }
  | { readonly kind: 'changed'; readonly spec: string; readonly threshold: number };

/** A gate with its outcome on one diff. */
export interface GateOutcome {
  readonly gate: string;
  readonly tripped: boolean;
  readonly reason: string;
}

const SYNTAX = `expected one of: broken, degraded, no-longer-proven, refuted, changed>P% (P a percentage) or changed>F (F a fraction in [0, 1]), none`;

/**
 * Parses `--fail-on` values: each value may hold several gates separated by commas.
 * `broken` trips when a rule that held on the old model is refuted on the new one;
 * `degraded` when a rule refuted on both is refuted clearly at least twice as often on the new one;
 * `no-longer-proven` when a rule proven on the old model is not proven on the new one;
 * `refuted` when any rule is refuted on the new model (also those already refuted before);
 * `changed>0.5%` (or `changed>0.005`) when the estimated changed share of the domain exceeds it;
 * `none` turns every gate off.
 * @throws UsageError naming the value and the accepted forms
 */
export function parseFailOn(values: readonly string[]): Gate[] {
  const gates: Gate[] = [];
  for (const value of values) {
    for (const raw of value.split(',')) {
      const spec = raw.trim().toLowerCase();
      if (spec === 'none' || spec === '') continue;
      if (spec === 'broken' || spec === 'degraded' || spec === 'no-longer-proven') {
        gates.push({ kind: 'verdict', spec, verdict: spec });
        continue;
      }
      if (spec === 'refuted') {
        gates.push({ kind: 'refuted', spec });
        continue;
      }
      const m = /^changed\s*>\s*([0-9]*\.?[0-9]+(?:e[-+]?[0-9]+)?)\s*(%?)$/.exec(spec);
      const threshold = m ? Number(m[1]) / (m[2] === '%' ? 100 : 1) : NaN;
      if (!m || !(threshold >= 0 && threshold <= 1)) throw new UsageError(`--fail-on: ${SYNTAX}; found '${raw.trim()}'`);
      gates.push({ kind: 'changed', spec: spec.replace(/\s+/g, ''), threshold });
    }
  }
  if (values.some((v) => v.split(',').some((s) => s.trim().toLowerCase() === 'none')) && gates.length > 0) {
    throw new UsageError(`--fail-on: 'none' cannot be combined with other gates, found '${values.join(',')}'`);
  }
  return gates;
}

/** Evaluates each gate on a diff: tripped or not, with the figure that decided it. */
export function evaluateGates(result: DiffResult, gates: readonly Gate[]): GateOutcome[] {
  return gates.map((gate): GateOutcome => {
    if (gate.kind === 'changed') {
      const c = result.changed;
      const tripped = c.value > gate.threshold;
      return { gate: gate.spec, tripped, reason: `changed share ${fmt(c.value)} (interval ${fmt(c.lower)} – ${fmt(c.upper)}) ${tripped ? '>' : '<='} ${fmt(gate.threshold)}` };
    }
    const ids = result.rules
      .filter((r) => (gate.kind === 'refuted' ? r.after.status === 'refuted' : r.verdict === gate.verdict))
      .map((r) => r.rule.id);
    const what = gate.kind === 'refuted' ? 'refuted on the new model' : gate.verdict;
    return { gate: gate.spec, tripped: ids.length > 0, reason: ids.length > 0 ? `${ids.length} rule${ids.length > 1 ? 's' : ''} ${what}: ${ids.join(', ')}` : `no rule ${what}` };
  });
}

function fmt(x: number): string {
  return `${(100 * x).toPrecision(3)} %`;
}
