/**
 * The hazard cautions every output carries: the terminal summary, rules.md, the report and
 * every export. Worded once here so that all outputs say the same thing.
 */
export const CAUTIONS: readonly string[] = [
  'These rules describe what this model file computes on the stated input box. They are not safety requirements and do not say that the behaviour is safe.',
  '"sampled" is statistical evidence, not proof: a violation can hide between samples.',
  '"proven" covers the model as read from the file, inputs inside the rule\'s box, and the stated numerical margin; it does not cover sensors, pre-processing outside the model, timing, or closed-loop behaviour.',
  'Using these results in certification or operational approval rests with the accountable engineers under the standards and authorities that apply (for example DO-178C/ED-12C with DO-330 for tool qualification and ARP4754A in aviation; ISO 26262 and ISO 21448 for road vehicles; IEC 61508; COLREGs and the flag state for vessels). Specula is not qualified under any of them.',
];

/** The cautions as plain-text lines with a heading, for terminals and text exports. */
export function cautionsText(prefix = ''): string {
  return [`${prefix}CAUTION`, ...CAUTIONS.map((c) => `${prefix}- ${c}`)].join('\n');
}
