import { describe, expect, it } from 'vitest';
import { readReferenceTable } from '../../src/reference/index.js';
import { FileError } from '../../src/errors.js';
import type { Scenario } from '../../src/types.js';
import { THRESHOLD_ADVISORIES, THRESHOLD_INPUTS } from '../diff/threshold-network.js';
import { AXIS, gridTableCsv, writeTemp } from './grid-table.js';

const SCENARIO = { inputs: THRESHOLD_INPUTS, advisories: THRESHOLD_ADVISORIES } as unknown as Scenario;

/** The error message of reading a table, with its path shown as F. */
function failure(text: string): { code: string; message: string } {
  const path = writeTemp('table.csv', text);
  try {
    readReferenceTable(path, SCENARIO);
  } catch (e) {
    if (e instanceof FileError) return { code: e.code, message: e.message.split(path).join('F') };
    throw e;
  }
  throw new Error('no error thrown');
}

describe('readReferenceTable', () => {
  it('reads a full grid in any row and column order into grid order', () => {
    const csv = gridTableCsv(4, 6, ['advisory', 'x2', 'x1']);
    const [header, ...rows] = csv.trim().split('\n');
    const path = writeTemp('t.csv', [header, ...rows.reverse()].join('\r\n'));
    const grid = readReferenceTable(path, SCENARIO);
    expect(grid.axes).toEqual([AXIS, AXIS]);
    expect(grid.n).toBe(100);
    // grid order: x2 varies fastest; point 13 is x1 = 1.5, x2 = 3.5, region A (x1 < 4)
    expect([grid.x[26], grid.x[27], grid.advisory[13]]).toEqual([1.5, 3.5, 0]);
    // point 97 is x1 = 9.5, x2 = 7.5: region C; rows were reversed, so it came from line 4
    expect([grid.advisory[97], grid.line[97]]).toEqual([2, 4]);
  });

  it('names missing and unknown columns', () => {
    expect(failure('x1,bearing,advice\n1,2,A\n')).toMatchInlineSnapshot(`
      {
        "code": "REFERENCE_INVALID",
        "message": "F line 1: missing columns 'x2', 'advisory'; expected columns: x1, x2, advisory
      F line 1: unknown columns 'bearing', 'advice'; expected columns: x1, x2, advisory",
      }
    `);
  });

  it('names every bad value with its line and column: not a number, outside the domain, unknown advisory', () => {
    expect(failure('x1,x2,advisory\n1,2,A\nabc,2,A\n1,12.5,A\n1,3,keep\n')).toMatchInlineSnapshot(`
      {
        "code": "REFERENCE_INVALID",
        "message": "F line 3, column x1: expected a number, found 'abc'
      F line 4, column x2: 12.5 lies outside the domain [0, 10]
      F line 5, column advisory: unknown advisory 'keep', advisories are: A, B, C",
      }
    `);
  });

  it('refuses a point given twice, naming both lines', () => {
    expect(failure('x1,x2,advisory\n1,2,A\n1,3,A\n1,2,B\n')).toMatchInlineSnapshot(`
      {
        "code": "REFERENCE_INVALID",
        "message": "F line 4: grid point x1 = 1, x2 = 2 already given on line 2",
      }
    `);
  });

  it('refuses a ragged grid, naming missing points', () => {
    const csv = gridTableCsv(4, 6).trim().split('\n');
    csv.splice(5, 2); // drop x1 = 0.5 with x2 = 4.5 and 5.5
    expect(failure(csv.join('\n'))).toMatchInlineSnapshot(`
      {
        "code": "REFERENCE_INVALID",
        "message": "F: the grid is incomplete (ragged): 2 of 100 points of the x1 10 × x2 10 grid are missing, e.g. x1 = 0.5, x2 = 4.5; x1 = 0.5, x2 = 5.5",
      }
    `);
  });

  it('refuses rows with another number of fields than the header', () => {
    expect(failure('x1,x2,advisory\n1,2,A\n1,3\n').message).toBe('F line 3: 2 fields, the header has 3');
  });
});
