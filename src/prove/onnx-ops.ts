import onnxProto from 'onnx-proto';
import type { ChainBuilder } from './chain-builder.js';
import type { ConstTensor } from './onnx-tensor.js';
import { affineDraft, diagonalDraft } from './affine.js';
import { FLOAT32_UNDERFLOW, gamma } from './float-error.js';

type Node = onnxProto.onnx.INodeProto;

/** What a node translation needs from the graph walk. */
export interface OpContext {
  readonly builder: ChainBuilder;
  /** Constant operands by value name (initializers and Constant node outputs). */
  readonly consts: ReadonlyMap<string, ConstTensor>;
  /** The data value's name (the chain's current value). */
  readonly data: string;
  /** Rank of the graph input, undefined when not declared. */
  readonly inputRank: number | undefined;
  readonly name: string;
}

function attr(node: Node, name: string): onnxProto.onnx.IAttributeProto | undefined {
  return (node.attribute ?? []).find((a) => a.name === name);
}

function intAttr(node: Node, name: string, fallback: number): number {
  const a = attr(node, name);
  return a?.i === undefined || a.i === null ? fallback : Number(a.i);
}

function floatAttr(node: Node, name: string, fallback: number | undefined): number | undefined {
  const a = attr(node, name);
  return a?.f === undefined || a.f === null ? fallback : Math.fround(a.f);
}

/** A constant broadcast along the data's last axis to `width` values, or a reason. */
function perChannel(t: ConstTensor, width: number | undefined): Float64Array | string {
  const inner = t.dims.filter((d) => d !== 1);
  if (t.values.length === 1) {
    if (width === undefined) return 'the input width is unknown before this node';
    return new Float64Array(width).fill(t.values[0]!);
  }
  if (inner.length === 1 && t.dims[t.dims.length - 1] === t.values.length && (width === undefined || width === t.values.length)) {
    return Float64Array.from(t.values);
  }
  return `constant of shape [${t.dims.join(', ')}] does not broadcast along a data width of ${width ?? 'unknown'}`;
}

function gemm(node: Node, ctx: OpContext, matmul: boolean): string | null {
  const [a, b, c] = node.input ?? [];
  if (a !== ctx.data) return 'the data must be the first operand (A); a constant A times data is not a [batch, k] layer';
  const bt = ctx.consts.get(b ?? '');
  if (!bt || bt.dims.length !== 2) return 'the second operand must be a constant matrix';
  const transA = matmul ? 0 : intAttr(node, 'transA', 0);
  if (transA !== 0) return 'transA = 1 on the data operand is not a [batch, k] layout';
  const transB = matmul ? 0 : intAttr(node, 'transB', 0);
  const alpha = matmul ? 1 : (floatAttr(node, 'alpha', 1) as number);
  const beta = matmul ? 1 : (floatAttr(node, 'beta', 1) as number);
  const [r0, r1] = bt.dims as [number, number];
  const k = transB ? r1 : r0;
  const n = transB ? r0 : r1;
  const w = new Float64Array(n * k);
  // alpha·B and beta·C are products of two float32 values: exact in float64
  for (let j = 0; j < n; j++) for (let i = 0; i < k; i++) w[j * k + i] = alpha * bt.values[transB ? j * k + i : i * n + j]!;
  let bias = new Float64Array(n);
  if (c) {
    const ct = ctx.consts.get(c);
    if (!ct) return 'the bias operand C must be a constant';
    const cb = perChannel(ct, n);
    if (typeof cb === 'string') return cb;
    bias = cb.map((v) => beta * v);
  }
  // Σ over k products, then alpha, beta·C and the addition: k + 3 roundings at most
  const g = gamma(k + 3);
  const errorWeights = w.map((v) => g * Math.abs(v));
  const konst = bias.map((v) => g * Math.abs(v) + 2 * (k + 3) * FLOAT32_UNDERFLOW);
  return ctx.builder.affine(affineDraft(k, n, w, bias, errorWeights, konst, [ctx.name]));
}

function elementwise(node: Node, ctx: OpContext, op: string): string | null {
  const [x, y] = node.input ?? [];
  const dataFirst = x === ctx.data;
  const other = ctx.consts.get((dataFirst ? y : x) ?? '');
  if (!other) return 'the other operand must be a constant';
  const cv = perChannel(other, ctx.builder.width);
  if (typeof cv === 'string') return cv;
  const n = cv.length;
  const d = new Float64Array(n);
  const b = new Float64Array(n);
  const scale = new Float64Array(n);
  const konst = new Float64Array(n).fill(FLOAT32_UNDERFLOW);
  const u = gamma(1);
  for (let j = 0; j < n; j++) {
    const v = cv[j]!;
    if (op === 'Add' || op === 'Sub') {
      // one rounding of x ± c: |err| ≤ u(|x| + |c|)
      d[j] = op === 'Sub' && !dataFirst ? -1 : 1;
      b[j] = op === 'Sub' && dataFirst ? -v : v;
      scale[j] = u;
      konst[j] = u * Math.abs(v) + FLOAT32_UNDERFLOW;
    } else if (op === 'Mul') {
      d[j] = v;
      scale[j] = u * Math.abs(v);
    } else {
      if (!dataFirst) return 'dividing a constant by the data is not affine';
      if (v === 0) return 'division by a zero constant';
      // 1/c is rounded in float64 (relative 2^-53): charged with the float32 rounding of x/c
      d[j] = 1 / v;
      scale[j] = (u + 2 ** -51) * Math.abs(d[j]!);
    }
  }
  return ctx.builder.affine(diagonalDraft(d, b, scale, konst, [ctx.name]));
}

function reshape(node: Node, ctx: OpContext): string | null {
  const shape = ctx.consts.get(node.input?.[1] ?? '');
  if (!shape) return 'the target shape must be a constant';
  const s = Array.from(shape.values);
  const w = ctx.builder.width;
  if (w !== undefined && s[s.length - 1] === w) return null;
  if (s.length === 2 && s[0] === 0 && s[1] === -1) return null;
  return `target shape [${s.join(', ')}] does not keep rows of width ${w ?? 'unknown'}`;
}

function clip(node: Node, ctx: OpContext): string | null {
  const scalar = (i: number): number | undefined | string => {
    const name = node.input?.[i];
    if (!name) return undefined;
    const t = ctx.consts.get(name);
    if (!t || t.values.length !== 1) return `operand ${i} must be a scalar constant`;
    return t.values[0]!;
  };
  let lo = scalar(1);
  let hi = scalar(2);
  if (typeof lo === 'string') return lo;
  if (typeof hi === 'string') return hi;
  // opset < 11 has min/max attributes; their defaults are ∓FLT_MAX, i.e. no bound
  lo ??= floatAttr(node, 'min', undefined);
  hi ??= floatAttr(node, 'max', undefined);
  if (lo !== undefined && lo <= -3.4e38) lo = undefined;
  if (hi !== undefined && hi >= 3.4e38) hi = undefined;
  return ctx.builder.clip(lo, hi, ctx.name);
}

/**
 * Translates one ONNX node on the data chain into layers.
 * @returns null when translated, otherwise the reason it is not supported
 */
export function translateNode(node: Node, ctx: OpContext): string | null {
  const op = node.opType ?? '';
  switch (op) {
    case 'Gemm':
      return gemm(node, ctx, false);
    case 'MatMul':
      return gemm(node, ctx, true);
    case 'Add':
    case 'Sub':
    case 'Mul':
    case 'Div':
      return elementwise(node, ctx, op);
    case 'Relu':
      return ctx.builder.activation('relu', ctx.name);
    case 'Sigmoid':
      return ctx.builder.activation('sigmoid', ctx.name);
    case 'Tanh':
      return ctx.builder.activation('tanh', ctx.name);
    case 'LeakyRelu':
      return ctx.builder.leakyRelu(floatAttr(node, 'alpha', Math.fround(0.01)) as number, ctx.name);
    case 'Clip':
      return clip(node, ctx);
    case 'Identity':
      return null;
    case 'Flatten':
      if (intAttr(node, 'axis', 1) !== 1 || (ctx.inputRank !== undefined && ctx.inputRank !== 2)) {
        return 'only Flatten with axis 1 on [batch, k] data is a no-op';
      }
      return null;
    case 'Reshape':
      return reshape(node, ctx);
    default:
      return `operator ${op} is not supported by the prover`;
  }
}
