import { EngineError } from '../../src-renderer/engine/errors';

/** Runs `f` and returns the EngineError it throws; fails the test when it throws nothing or something else. */
export function thrown(f: () => unknown): EngineError {
  try {
    f();
  } catch (e) {
    if (e instanceof EngineError) return e;
    throw e;
  }
  throw new Error('expected an EngineError');
}
