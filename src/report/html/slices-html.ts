import type { RuleTable } from '../../types.js';
import type { SliceSet } from './build-slices.js';
import { escapeHtml as e } from './escape-html.js';
import { NEAR_SLICE_FRACTION } from './slice-data.js';
import { HALO_WIDTH, OUTLINE_ORDER, OUTLINE_STYLES, POINT_FILL } from './outline-styles.js';

/** The key of the outline styles and the counterexample marker, as small inline SVG samples. */
function keyHtml(): string {
  const lines = [...OUTLINE_ORDER].reverse().map((s) => {
    const st = OUTLINE_STYLES[s];
    const dash = st.dash.length ? ` stroke-dasharray="${st.dash.join(',')}"` : '';
    return (
      `<div><svg width="44" height="14" aria-hidden="true"><line x1="2" y1="7" x2="42" y2="7" stroke="#fff" stroke-width="${HALO_WIDTH}"/>` +
      `<line x1="2" y1="7" x2="42" y2="7" stroke="${st.stroke}" stroke-width="${st.strokeWidth}"${dash}/></svg>${e(st.label)}</div>`
    );
  });
  const cross = `<div><svg width="44" height="14" aria-hidden="true"><path d="M20,1h4v4h4v4h-4v4h-4v-4h-4v-4h4z" fill="${POINT_FILL}" stroke="#fff" stroke-width="1"/></svg>counterexample within ${NEAR_SLICE_FRACTION * 100} % of the plane</div>`;
  return `<div class="key"><strong>Rule boxes cutting the plane</strong>${lines.join('')}${cross}</div>`;
}

function plural(n: number, one: string, many: string): string {
  return `${n} ${n === 1 ? one : many}`;
}

function heldText(table: RuleTable, pair: readonly [number, number], x: readonly number[]): string {
  const parts = table.inputs.flatMap((inp, k) => (k === pair[0] || k === pair[1] ? [] : [`${e(inp.name)} = ${+x[k]!.toPrecision(6)}${inp.unit ? ` ${e(inp.unit)}` : ''}`]));
  return parts.length ? parts.join(', ') : 'no other inputs';
}

/**
 * The slice-plot section: a choice of input pair and held point, one pre-rendered SVG figure
 * per combination (`<figure class="slice" data-pair data-held>`, all but the first hidden until
 * the script switches them), the outline key, and how to read the plots.
 */
export function slicesHtml(table: RuleTable, slices: SliceSet): string {
  const out: string[] = ['<section id="slices"><h2>Slices through the network</h2>'];
  if (slices.figures.length === 0) {
    out.push('<p class="muted">No slice plots: they need at least two inputs and the model.</p></section>');
    return out.join('\n');
  }
  out.push(
    '<p>Each plot shows a plane through the input box: two inputs vary over their whole range, the others are held fixed. ' +
      "The colours are the network's own advisories, computed by running the model on a grid of cell centres; " +
      'the outlines are the boxes of the rules that cut this plane (click one for its evidence). ' +
      'Colours grow darker from the first advisory to the last, so the regions also read in greyscale.</p>',
  );
  const pairOpts = slices.pairs.map((p, i) => `<option value="${i}">${e(table.inputs[p[0]]!.name)} × ${e(table.inputs[p[1]]!.name)}</option>`).join('');
  const heldOpts = slices.helds.map((h, i) => `<option value="${i}">${e(h.label)}</option>`).join('');
  out.push(
    '<div class="controls">',
    `<label>inputs <select id="slice-pair">${pairOpts}</select></label>`,
    `<label>others held at <select id="slice-held">${heldOpts}</select></label>`,
    '</div><div class="slice-view"><div class="slice-figures">',
  );
  slices.figures.forEach((f, i) => {
    const pi = slices.pairs.indexOf(f.pair);
    const held = slices.helds[f.held]!;
    out.push(
      `<figure class="slice" data-pair="${pi}" data-held="${f.held}" data-outlines="${e(f.outlineIds.join(' '))}"${i === 0 ? '' : ' hidden'}>`,
      f.svg,
      `<figcaption>${e(table.inputs[f.pair[0]]!.name)} × ${e(table.inputs[f.pair[1]]!.name)}; ${e(held.label)}: ${heldText(table, f.pair, held.x)}. ` +
        `${plural(f.outlineIds.length, 'rule box cuts', 'rule boxes cut')} this plane${f.pointIds.length ? `; ${plural(f.pointIds.length, 'counterexample lies', 'counterexamples lie')} near it` : ''}.</figcaption>`,
      '</figure>',
    );
  });
  out.push('</div>', keyHtml(), '</div></section>');
  return out.join('\n');
}
