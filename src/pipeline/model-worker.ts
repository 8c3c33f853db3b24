import { workerData } from 'node:worker_threads';
import { ModelError } from '../errors.js';
import { loadModel } from '../model/index.js';
import { checkRules, fidelityChunk } from '../check/index.js';
import { serveTasks } from '../pool/index.js';
import type { ModelResult, ModelTask, ModelWorkerInit } from './model-worker-protocol.js';

/**
 * A model worker: loads the model once (one intra-op thread: the cores are shared out by
 * threads, not inside onnxruntime), then runs the tasks it is sent one at a time — the very
 * functions the main thread runs when there are no workers, so the results are the same.
 */
const init = workerData as ModelWorkerInit;

await serveTasks<ModelTask, ModelResult>(async () => {
  const model = await loadModel(init.scenario, { modelPath: init.modelPath, threads: 1, batchSize: init.batchSize });
  if (model.sha256 !== init.modelSha256) {
    throw new ModelError('MODEL_CHANGED', `${init.modelPath}: the file changed while the run was going`);
  }
  const { inputs } = init.scenario;
  return async (task) => {
    switch (task.kind) {
      case 'label':
        await model.labelInPlace(task.x, task.from, task.rows, task.advisory, task.margin);
        return null;
      case 'check':
        return (await checkRules([task.rule], inputs, model.evaluate, task.options))[0]!;
      case 'fidelity':
        return fidelityChunk(task.rules, inputs, model.evaluate, task.seed, task.chunk, task.rows, task.advisories);
    }
  };
});
