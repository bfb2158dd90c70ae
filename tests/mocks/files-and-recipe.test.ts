import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { readMeshField, writeMeshField } from '../../src/mocks/field-file.js';
import { validateMockRecipe } from '../../src/mocks/mock-recipe.js';
import { readParticleTable } from '../../src/mocks/particle-file.js';

const folder = mkdtempSync(join(tmpdir(), 'treble-mockfiles-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

describe('mock files and recipes', () => {
  it('a mesh field survives writing and reading exactly, header numbers included', () => {
    const values = Float64Array.from({ length: 64 }, (_, i) => Math.sin(i) * 1e-3 + i);
    const path = join(folder, 'f.json');
    writeMeshField(path, { mesh: { n: 4, boxSize: 250 }, values, about: { redshift: 0.5, seed: 9 } });
    const back = readMeshField(path);
    expect(back.mesh).toEqual({ n: 4, boxSize: 250 });
    expect(back.values).toEqual(values);
    expect(back.about).toEqual({ redshift: 0.5, seed: 9 });
  });

  it('a truncated values file is an input error naming the file', () => {
    const path = join(folder, 'g.json');
    writeMeshField(path, { mesh: { n: 4, boxSize: 250 }, values: new Float64Array(64), about: {} });
    writeFileSync(join(folder, 'g.f64'), Buffer.alloc(10));
    expect(() => readMeshField(path)).toThrow(/g\.f64: holds 10 bytes/);
  });

  it('reads particle positions by column name', () => {
    const path = join(folder, 'p.csv');
    writeFileSync(path, 'id,z,y,x\n1,3,2,1\n2,6,5,4\n');
    expect(Array.from(readParticleTable(path))).toEqual([1, 2, 3, 4, 5, 6]);
  });

  it('a recipe lists every problem by key', () => {
    expect(() => validateMockRecipe({ mesh: { n: 12, boxSize: 100 }, redshift: -1, seed: 1, bias: { b1: 2 }, order: 'third', colour: 1 }, 'r.json')).toThrow(
      /r\.json: colour is not a known key[\s\S]*mesh\.n must be a power of two[\s\S]*redshift must be a number >= 0[\s\S]*order must be "linear", "second" or "2lpt"/,
    );
  });
});
