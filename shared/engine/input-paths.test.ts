import { describe, expect, it } from 'vitest';
import { checkStructureMode, checkTmdParameters, prefixEngineInputError, withPathPrefix } from './input-paths';
import { EngineInputError } from './linalg';
import { createModeTmdSystem } from './response';

function caught(run: () => unknown): EngineInputError {
  try {
    run();
  } catch (error) {
    if (error instanceof EngineInputError) return error;
    throw error;
  }
  throw new Error('expected an EngineInputError');
}

describe('checks of a mode and a damper report the path inside their own input', () => {
  it('a mode names its own field', () => {
    const error = caught(() => checkStructureMode({ modalMassKg: 1000, frequencyHz: 2, dampingRatio: 1.2 }));
    expect(error.field).toBe('dampingRatio');
    expect(error.message).toBe('dampingRatio: must be a damping ratio in [0, 1) (got 1.2)');
  });

  it('a damper names its own field', () => {
    expect(caught(() => checkTmdParameters({ massKg: -1, frequencyHz: 2, dampingRatio: 0.1 })).field).toBe('massKg');
  });

  it('the holder puts its place in front: structure. in a command, a form field of a stored mode', () => {
    const inCommand = caught(() => withPathPrefix('structure', () => checkStructureMode({ modalMassKg: 1000, frequencyHz: 0, dampingRatio: 0.01 })));
    expect(inCommand.field).toBe('structure.frequencyHz');
    expect(inCommand.message).toBe('structure.frequencyHz: must be a finite number greater than 0 (got 0)');
    const inForm = caught(() => withPathPrefix('modes.3', () => checkStructureMode({ modalMassKg: 1000, frequencyHz: 2, dampingRatio: -1 })));
    expect(inForm.field).toBe('modes.3.dampingRatio');
    expect(inForm.message).toMatch(/^modes\.3\.dampingRatio: must be a damping ratio/);
  });

  it('other errors pass unchanged; an empty prefix changes nothing', () => {
    const other = new RangeError('not an input error');
    expect(prefixEngineInputError('structure', other)).toBe(other);
    const input = new EngineInputError('massKg', 'massKg: must be positive definite');
    expect(prefixEngineInputError('', input)).toBe(input);
    expect(withPathPrefix('x', () => 42)).toBe(42);
  });

  it('createModeTmdSystem reports structure.… and tmds.<j>.… as before', () => {
    expect(caught(() => createModeTmdSystem({ modalMassKg: 0, frequencyHz: 2, dampingRatio: 0.01 }, [])).field).toBe('structure.modalMassKg');
    const tmd = caught(() =>
      createModeTmdSystem({ modalMassKg: 1, frequencyHz: 2, dampingRatio: 0 }, [
        { massKg: 0.01, frequencyHz: 2, dampingRatio: 0.1 },
        { massKg: 0.01, frequencyHz: 2, dampingRatio: 1 },
      ]),
    );
    expect(tmd.field).toBe('tmds.1.dampingRatio');
    expect(tmd.message).toMatch(/^tmds\.1\.dampingRatio: must be a damping ratio in \[0, 1\)/);
  });
});
