import { workerData } from 'node:worker_threads';
import { ModelError } from '../errors.js';
import { loadModel } from '../model/index.js';
import { serveTasks } from '../pool/index.js';
import type { CheckedRule } from '../types.js';
import type { ProveTask, WorkerInit } from './prove-worker-protocol.js';
import { readNetworkOf } from './read-network.js';
import { settleRule } from './settle-rule.js';

/** A proof worker: loads the model once, then settles the rules it is sent, one at a time. */
const init = workerData as WorkerInit;

await serveTasks<ProveTask, CheckedRule[]>(async () => {
  const model = await loadModel(init.scenario, { modelPath: init.modelPath, threads: 1 });
  if (model.sha256 !== init.modelSha256) {
    throw new ModelError('MODEL_CHANGED', `${init.modelPath}: the file changed while the run was going`);
  }
  const network = readNetworkOf(model);
  if (!network.supported) throw new ModelError('MODEL_UNSUPPORTED', `${init.modelPath}: not provable (${network.operator})`);
  return (task) =>
    settleRule(network.network, task.checked, init.scenario, model, {
      maxBoxes: init.maxBoxes,
      maxSeconds: init.maxSeconds,
      now: () => performance.now(),
      repair: init.repair,
      check: init.check,
    });
});
