import { SurmiseError } from '../../src/errors.ts';

/** The SurmiseError `f` throws (any other error is rethrown; no error fails the test). */
export function caught(f: () => unknown): SurmiseError {
  try {
    f();
  } catch (e) {
    if (e instanceof SurmiseError) return e;
    throw e;
  }
  throw new Error('expected a SurmiseError');
}

/** The code of the SurmiseError `f` throws, or 'none' when it throws nothing. */
export function codeOf(f: () => unknown): string {
  try {
    f();
  } catch (e) {
    if (e instanceof SurmiseError) return e.code;
    throw e;
  }
  return 'none';
}
