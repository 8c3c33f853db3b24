import type { RuleStatus } from '../../types.js';

/** How a rule box is outlined on a slice plot, by status; shared by the plots and the page's key. */
export interface OutlineStyle {
  readonly stroke: string;
  readonly strokeWidth: number;
  /** SVG dash array; empty for solid. */
  readonly dash: readonly number[];
  readonly label: string;
}

/**
 * Solid for proven, dashed for sampled, dotted for unknown, dash-dot in red for refuted. The
 * dash patterns alone tell the statuses apart (greyscale, colour-blind readers); every outline
 * is drawn over a wider white halo so it stays visible on light and dark regions alike.
 */
export const OUTLINE_STYLES: Readonly<Record<RuleStatus, OutlineStyle>> = {
  proven: { stroke: '#000000', strokeWidth: 2, dash: [], label: 'proven (solid)' },
  sampled: { stroke: '#000000', strokeWidth: 2, dash: [7, 4], label: 'sampled (dashed)' },
  unknown: { stroke: '#000000', strokeWidth: 1.5, dash: [2, 3], label: 'unknown (dotted)' },
  refuted: { stroke: '#c8001e', strokeWidth: 2.5, dash: [9, 3, 2, 3], label: 'refuted (red, dash-dot)' },
};

/** Statuses in the order their outlines are drawn (later on top). */
export const OUTLINE_ORDER: readonly RuleStatus[] = ['unknown', 'sampled', 'proven', 'refuted'];

/** Width of the white halo under every outline, in pixels. */
export const HALO_WIDTH = 4.5;
/** Counterexample markers: a red cross with a white edge. */
export const POINT_FILL = '#c8001e';
