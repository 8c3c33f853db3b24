import { describe, expect, it } from 'vitest';
import { ModelError, ToolError } from '../../src/errors.js';
import { workerPool, errorData, reviveError, startWorker } from '../../src/pool/index.js';

/** The pool against its fixture worker (test/pool/fixture-worker.ts): plain arithmetic as the reference. */
function pool(size: number, depth = 1, failStart = false) {
  return workerPool<{ value: number; turns: number }, { square: number; thread: number }>({
    base: import.meta.url,
    name: './fixture-worker',
    workerData: { failStart },
    size,
    depth,
  });
}

describe('workerPool', () => {
  it('gives each task its own result, in the caller\'s order, spread over every worker', async () => {
    const p = pool(2, 2);
    try {
      await p.ready(); // both up: the first tasks go two to each
      // uneven work: later tasks often finish first
      const values = Array.from({ length: 24 }, (_, i) => i);
      const results = await Promise.all(values.map((v) => p.run({ value: v, turns: (7 * v) % 5 })));
      expect(results.map((r) => r.square)).toEqual(values.map((v) => v * v));
      expect(new Set(results.map((r) => r.thread)).size).toBe(2);
    } finally {
      await p.close();
    }
  });

  it('rejects a failing task with the worker\'s error class, code and message, and keeps serving', async () => {
    const p = pool(1);
    try {
      const failure = await p.run({ value: -2, turns: 0 }).catch((e: unknown) => e);
      expect(failure).toBeInstanceOf(ModelError);
      expect((failure as ModelError).code).toBe('MODEL_NONFINITE_SCORE');
      expect((failure as ModelError).message).toBe('fixture: negative value -2');
      expect((await p.run({ value: 3, turns: 0 })).square).toBe(9);
    } finally {
      await p.close();
    }
  });

  it('rejects every task when a worker cannot start', async () => {
    const p = pool(2, 1, true);
    try {
      const failures = await Promise.all([1, 2, 3].map((v) => p.run({ value: v, turns: 0 }).catch((e: unknown) => e)));
      for (const f of failures) expect((f as ToolError).message).toBe('fixture: start-up refused');
      await expect(p.ready()).rejects.toThrow('fixture: start-up refused');
      await expect(p.run({ value: 1, turns: 0 })).rejects.toThrow('fixture: start-up refused');
    } finally {
      await p.close();
    }
  });

  it('rejects tasks after close', async () => {
    const p = pool(1);
    await p.close();
    await expect(p.run({ value: 1, turns: 0 })).rejects.toThrow('is closed');
  });
});

describe('errorData and reviveError', () => {
  it('carry a ToolError subclass across as data and back, and anything else as a plain Error', () => {
    const back = reviveError(errorData(new ModelError('MODEL_RUN', 'x.onnx: failed')));
    expect(back).toBeInstanceOf(ModelError);
    expect([back.name, (back as ModelError).code, back.message]).toEqual(['ModelError', 'MODEL_RUN', 'x.onnx: failed']);
    const plain = reviveError(errorData(new RangeError('bad')));
    expect(plain).not.toBeInstanceOf(ToolError);
    expect(plain.message).toBe('bad');
  });
});

describe('serveTasks and a stop message', () => {
  // A stopped worker must end by itself (exit code 0), never by terminate (exit code 1): a
  // thread terminated while onnxruntime works for it can abort the whole process.
  it('ends the thread by itself after the tasks before the stop, also when the stop comes during start-up', async () => {
    const worker = startWorker(import.meta.url, './fixture-worker', { failStart: false });
    const replies: unknown[] = [];
    worker.on('message', (m) => replies.push(m));
    // sent at once, before the worker has started: they wait in the port until it listens
    worker.postMessage({ id: 0, task: { value: 3, turns: 2 } });
    worker.postMessage({ kind: 'stop' });
    const code = await new Promise<number>((resolve) => worker.once('exit', resolve));
    expect(code).toBe(0);
    expect(replies).toContainEqual(expect.objectContaining({ kind: 'done', id: 0, result: expect.objectContaining({ square: 9 }) }));
  });
});
