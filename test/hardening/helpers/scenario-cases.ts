import { createRng } from '../../../src/train/index.js';

/** One fuzzed scenario file: its text, and the model file it should sit beside (default: the base model). */
export interface ScenarioCase {
  readonly kind: 'missing field' | 'wrong type' | 'non-finite number' | 'huge range' | '0-width input' | 'many inputs' | 'unknown key' | 'broken JSON' | 'random edit';
  readonly label: string;
  readonly text: string;
  /** Name of another model file to place beside the scenario as model.onnx (see scenarioCases). */
  readonly model?: 'wide';
  /** A wrong-type case whose replacement has the original's JSON type after all ("text" for a string). */
  readonly sameType?: true;
}

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };
type Path = ReadonlyArray<string | number>;

/** Every path into a JSON value (containers included), depth first. */
function pathsOf(value: Json, prefix: Path = []): Path[] {
  const out: Path[] = [];
  if (Array.isArray(value)) value.forEach((v, i) => out.push([...prefix, i], ...pathsOf(v, [...prefix, i])));
  else if (value !== null && typeof value === 'object') for (const [k, v] of Object.entries(value)) out.push([...prefix, k], ...pathsOf(v, [...prefix, k]));
  return out;
}

/** A deep copy with the value at `path` replaced, or removed when `replacement` is undefined. */
function edited(base: Json, path: Path, replacement: Json | undefined): Json {
  const copy = structuredClone(base) as Json;
  let parent = copy as Record<string | number, Json>;
  for (const key of path.slice(0, -1)) parent = parent[key] as Record<string | number, Json>;
  const last = path[path.length - 1]!;
  if (replacement !== undefined) parent[last] = replacement;
  else if (Array.isArray(parent)) parent.splice(last as number, 1);
  else delete parent[last];
  return copy;
}

const jsonType = (v: Json | undefined): string => (v === null ? 'null' : Array.isArray(v) ? 'array' : typeof v);
const at = (value: Json, path: Path): Json | undefined => path.reduce<Json | undefined>((v, k) => (v as Record<string | number, Json>)[k], value);
const show = (path: Path): string => path.map((k) => (typeof k === 'number' ? `[${k}]` : `.${k}`)).join('').slice(1) || '(root)';
const text = (value: Json): string => JSON.stringify(value, null, 2);

/**
 * Scenario files broken the ways hand-edited files break, from a valid scenario with three
 * numeric inputs and a normalisation: every field removed; every field given each wrong JSON
 * type; every number written as NaN, ±Infinity, ±1e999 or an extreme float; ranges too wide
 * for float64 arithmetic; each input 0 wide; 50 inputs (against the 3-input model, and against
 * a 50-input model, `model: 'wide'`); unknown keys; broken JSON text; and `randomEdits` seeded
 * random replacements anywhere in the tree.
 */
export function scenarioCases(base: Json, options: { seed: number; randomEdits: number }): ScenarioCase[] {
  const cases: ScenarioCase[] = [];
  const paths = pathsOf(base);
  const add = (kind: ScenarioCase['kind'], label: string, value: Json | string, extra: Partial<ScenarioCase> = {}): void =>
    void cases.push({ kind, label, text: typeof value === 'string' ? value : text(value), ...extra });
  for (const p of paths) add('missing field', `without ${show(p)}`, edited(base, p, undefined));
  const wrong: Json[] = ['text', 7, true, null, [], {}];
  for (const p of paths) {
    for (const w of wrong) {
      const same = jsonType(at(base, p)) === jsonType(w);
      add('wrong type', `${show(p)} = ${JSON.stringify(w)}`, edited(base, p, w), same ? { sameType: true } : {});
    }
  }
  const numeric = paths.filter((p) => typeof at(base, p) === 'number');
  const spellings = ['NaN', '"NaN"', 'Infinity', '"Infinity"', '-Infinity', '1e999', '-1e999', '1.7976931348623157e308', '5e-324', '-0'];
  for (const p of numeric) {
    for (const s of spellings) {
      const marker = '"__FUZZ__"';
      add('non-finite number', `${show(p)} = ${s}`, text(edited(base, p, '__FUZZ__')).replace(marker, s));
    }
  }
  const inputs = (base as { inputs: Json[] }).inputs;
  inputs.forEach((_, j) => {
    for (const [lo, hi] of [[-1e300, 1e300], [-1.7e308, 1.7e308], [0, 1e-300], [1e15, 1e15 + 1]] as const) {
      add('huge range', `inputs[${j}] in [${lo}, ${hi}]`, edited(edited(base, ['inputs', j, 'min'], lo), ['inputs', j, 'max'], hi));
      add('huge range', `inputs[${j}] in [${lo}, ${hi}], no normalize`, edited(edited(edited(base, ['inputs', j, 'min'], lo), ['inputs', j, 'max'], hi), ['normalize'], undefined));
    }
    const min = (inputs[j] as { min: number }).min;
    add('0-width input', `inputs[${j}] min = max`, edited(base, ['inputs', j, 'max'], min));
    add('0-width input', `inputs[${j}] min > max`, edited(base, ['inputs', j, 'max'], min - 1));
  });
  const wide = Array.from({ length: 50 }, (_, j): Json => ({ name: `x${j}`, unit: '', min: 0, max: 1 + j, description: `input ${j}` }));
  const withWide = edited(edited(base, ['inputs'], wide), ['normalize'], undefined);
  add('many inputs', '50 inputs, 3-input model', withWide);
  add('many inputs', '50 inputs, 50-input model', withWide, { model: 'wide' });
  add('many inputs', '65 inputs', edited(withWide, ['inputs'], [...wide, ...wide.slice(0, 15).map((v, j) => ({ ...(v as object), name: `y${j}` }))]));
  for (const p of [['surprise'], ['inputs', 0, 'surprise'], ['normalize', 'surprise'], ['Model']] as Path[]) add('unknown key', `${show(p)} added`, edited(base, p, 1));
  const good = text(base);
  const broken: Array<[string, string]> = [
    ['empty file', ''],
    ['whitespace only', ' \n\t\n'],
    ['a bare number', '42'],
    ['an array', '[]'],
    ['an empty object', '{}'],
    ['cut in half', good.slice(0, good.length >> 1)],
    ['trailing comma', good.replace(/\n}$/, ',\n}')],
    ['single quotes', good.replace(/"/g, "'")],
    ['a comment', `// scenario\n${good}`],
    ['two objects', `${good}\n${good}`],
    ['duplicate key', good.replace('"title"', '"name": "again",\n  "title"')],
    ['deep nesting', `${'['.repeat(100_000)}${']'.repeat(100_000)}`],
    ['a NUL byte', good.replace('"title"', '"ti\u0000tle"')],
  ];
  for (const [label, t] of broken) add('broken JSON', label, t);
  const rng = createRng(options.seed);
  const pool: Json[] = [0, -1, 1e-9, 1e9, -1e300, 'x', '', 'argmin', 'model.onnx', true, null, [], [0], [1, 2, 3], {}, { a: 1 }];
  for (let i = 0; i < options.randomEdits; i++) {
    const p = paths[Math.floor(rng() * paths.length)]!;
    const remove = rng() < 0.2;
    const v = pool[Math.floor(rng() * pool.length)]!;
    add('random edit', remove ? `without ${show(p)}` : `${show(p)} = ${JSON.stringify(v)}`, edited(base, p, remove ? undefined : v));
  }
  return cases;
}
