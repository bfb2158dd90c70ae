import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

/** The numpy reference of tests/fixtures/numpy-mocks/estimators.py. */
export interface NumpyMockFixture {
  source: string;
  fft: { n: number; field: number[]; re: number[]; im: number[] };
  field: {
    n: number;
    boxSize: number;
    kMinOverKf: number;
    dkOverKf: number;
    values: number[];
    power: { centre: number; modes: number; meanK: number; P0: number; P2: number; P4: number }[];
    triangles: { bin: [number, number, number]; count: number; kEffective: number[]; B0: number; B2: number }[];
  };
}

export const numpyMockFixture: NumpyMockFixture = JSON.parse(
  readFileSync(fileURLToPath(new URL('../fixtures/numpy-mocks/estimators.json', import.meta.url)), 'utf8'),
);
