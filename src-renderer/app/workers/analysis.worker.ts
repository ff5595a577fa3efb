/// <reference lib="webworker" />
/**
 * The analysis worker: file parsing, column preview, analysis and the shut-in
 * diagnostic series run here, so the
 * window never freezes on a large record or a long batch.
 */
import { isEngineError } from '../../engine/errors';
import { runEngineRequest } from './engineCalls';
import { transferablesOf, type WorkerReply, type WorkerRequest } from './protocol';

const scope = self as unknown as DedicatedWorkerGlobalScope;

scope.onmessage = async (event: MessageEvent<WorkerRequest>) => {
  const request = event.data;
  let reply: WorkerReply;
  try {
    reply = { id: request.id, ok: true, value: await runEngineRequest(request) };
  } catch (e) {
    if (isEngineError(e)) {
      reply = { id: request.id, ok: false, error: { name: e.name, code: e.code, message: e.message, location: { ...e.location }, expected: e.expected } };
    } else {
      const err = e instanceof Error ? e : new Error(String(e));
      reply = { id: request.id, ok: false, error: { name: err.name, code: 'internal', message: err.message, location: {} } };
    }
  }
  // The shut-in arrays go back by transfer (no copy of a million-sample series).
  scope.postMessage(reply, reply.ok && request.op === 'shut-in-diagnostics' ? transferablesOf(reply.value) : []);
};
