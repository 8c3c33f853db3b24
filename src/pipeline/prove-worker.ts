import { parentPort, workerData } from 'node:worker_threads';
import { ModelError, ToolError } from '../errors.js';
import { loadModel } from '../model/index.js';
import type { CheckedRule } from '../types.js';
import type { WorkerInit, WorkerReply } from './prove-worker-protocol.js';
import { readNetworkOf } from './read-network.js';
import { settleRule } from './settle-rule.js';

/** A proof worker: loads the model once, then settles the rules it is sent, one at a time. */
const init = workerData as WorkerInit;
const port = parentPort!;
const send = (m: WorkerReply): void => port.postMessage(m);

try {
  const model = await loadModel(init.scenario, { modelPath: init.modelPath, threads: 1 });
  if (model.sha256 !== init.modelSha256) {
    throw new ModelError('MODEL_CHANGED', `${init.modelPath}: the file changed while the run was going`);
  }
  const network = readNetworkOf(model);
  if (!network.supported) throw new ModelError('MODEL_UNSUPPORTED', `${init.modelPath}: not provable (${network.operator})`);
  port.on('message', async (m: { i: number; checked: CheckedRule }) => {
    try {
      const rules = await settleRule(network.network, m.checked, init.scenario, model, {
        maxBoxes: init.maxBoxes,
        maxSeconds: init.maxSeconds,
        now: () => performance.now(),
        repair: init.repair,
        check: init.check,
      });
      send({ kind: 'result', i: m.i, rules });
    } catch (e) {
      send({ kind: 'error', tool: e instanceof ToolError, code: (e as ToolError).code ?? 'INTERNAL', message: (e as Error).message });
    }
  });
  send({ kind: 'ready' });
} catch (e) {
  send({ kind: 'error', tool: e instanceof ToolError, code: (e as ToolError).code ?? 'INTERNAL', message: (e as Error).message });
}
