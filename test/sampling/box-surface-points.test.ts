import { describe, expect, it } from 'vitest';
import { boxSurfacePoints } from '../../src/sampling/box-surface-points.js';
import { createRng } from '../../src/sampling/rng.js';

function onBoundary(p: number[], box: ReadonlyArray<readonly [number, number]>): boolean {
  return p.some((v, j) => v === box[j]![0] || v === box[j]![1]) && p.every((v, j) => v >= box[j]![0] && v <= box[j]![1]);
}

describe('boxSurfacePoints', () => {
  const box = Object.freeze([[0, 1], [-5, 5], [2, 3]] as const);

  it('puts every point on the boundary and includes all 2^d corners when they fit', () => {
    const n = 200;
    const x = boxSurfacePoints(box, n, createRng(3));
    expect(x.length).toBe(n * 3);
    const rows = Array.from({ length: n }, (_, i) => Array.from(x.subarray(3 * i, 3 * i + 3)));
    expect(rows.every((p) => onBoundary(p, box))).toBe(true);
    const corners = new Set(rows.filter((p) => p.every((v, j) => v === box[j]![0] || v === box[j]![1])).map((p) => p.join(',')));
    expect(corners.size).toBe(8);
  });

  it('shares the face points equally between the 2d faces', () => {
    const n = 8 + 6 * 20 + 3; // 8 corners, then 123 face points: faces get 21, 21, 21, 20, 20, 20
    const x = boxSurfacePoints(box, n, createRng(4));
    const perFace = new Array<number>(6).fill(0);
    for (let i = 8; i < n; i++) {
      for (let j = 0; j < 3; j++) {
        if (x[3 * i + j] === box[j]![0]) perFace[2 * j]!++;
        else if (x[3 * i + j] === box[j]![1]) perFace[2 * j + 1]!++;
      }
    }
    expect(perFace).toEqual([21, 21, 21, 20, 20, 20]);
  });

  it('leaves the corners out when 2^d is more than half the points', () => {
    const x = boxSurfacePoints(box, 15, createRng(5));
    // without corners the first point lies on face 0 (axis 0 at min) with the other axes random
    expect(x[0]).toBe(0);
    expect(x[1]).not.toBe(-5);
    expect(boxSurfacePoints(box, 0, createRng(5)).length).toBe(0);
  });
});
