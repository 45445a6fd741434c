import { describe, it, expect } from 'vitest';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { dependencyVersions, sha256File } from '../../src/run/provenance.ts';

describe('run provenance', () => {
  it('sha256File of "abc" is the FIPS 180-2 example digest (Appendix B.1), with its size', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'surmise-prov-'));
    try {
      writeFileSync(join(dir, 'abc.txt'), 'abc');
      expect(await sha256File(join(dir, 'abc.txt'))).toEqual({
        sha256: 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad',
        bytes: 3,
      });
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
  it('records the installed versions of the libraries a run uses', () => {
    const v = dependencyVersions();
    expect(v.yaml).toMatch(/^\d+\.\d+\.\d+/);
    expect(v.commander).toMatch(/^14\./);
  });
});
