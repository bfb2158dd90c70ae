import { readFileSync, writeFileSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { InputError } from '../contracts/input-error.js';
import { checkMesh, type Mesh } from './mesh.js';

/**
 * A mesh field on disk (docs/conventions.md, "Mocks"): a JSON header
 *   { "format": "treble-mesh-field-1", "n", "boxSize", "quantity": "overdensity",
 *     "lineOfSight": "z-axis", "values": "<file>", "encoding": "float64-le",
 *     "order": "(ix n + iy) n + iz", "cosmology": { named numbers } (optional),
 *     ... extra numbers such as redshift }
 * beside a raw little-endian float64 file of the n^3 values.
 */
export const MESH_FIELD_FORMAT = 'treble-mesh-field-1';

export interface MeshFieldFile {
  readonly mesh: Mesh;
  readonly values: Float64Array;
  /** Extra named numbers of the header (redshift, numberDensity, seed, ...). */
  readonly about: Readonly<Record<string, number>>;
  /** Cosmological parameters the field was made with, when known. */
  readonly cosmology?: Readonly<Record<string, number>>;
}

/** Writes `<path>` (the header, ending .json) and `<path without .json>.f64`. */
export function writeMeshField(path: string, field: MeshFieldFile): void {
  if (!path.endsWith('.json')) throw new InputError(`mesh field: the header file name must end in .json, got ${path}`);
  const dataName = `${basename(path, '.json')}.f64`;
  const buf = Buffer.alloc(8 * field.values.length);
  field.values.forEach((v, i) => buf.writeDoubleLE(v, 8 * i));
  writeFileSync(join(dirname(path), dataName), buf);
  const header = {
    format: MESH_FIELD_FORMAT,
    n: field.mesh.n,
    boxSize: field.mesh.boxSize,
    quantity: 'overdensity',
    lineOfSight: 'z-axis',
    values: dataName,
    encoding: 'float64-le',
    order: '(ix n + iy) n + iz',
    ...(field.cosmology ? { cosmology: field.cosmology } : {}),
    ...field.about,
  };
  writeFileSync(path, `${JSON.stringify(header, null, 2)}\n`);
}

export function readMeshField(path: string): MeshFieldFile {
  let header: Record<string, unknown>;
  try {
    header = JSON.parse(readFileSync(path, 'utf8')) as Record<string, unknown>;
  } catch (e) {
    throw new InputError(`${path}: cannot read the mesh field header (${(e as Error).message})`, { where: path });
  }
  if (header.format !== MESH_FIELD_FORMAT) throw new InputError(`${path}: format must be "${MESH_FIELD_FORMAT}", got ${JSON.stringify(header.format)}`, { where: `${path}:format` });
  if (header.encoding !== 'float64-le') throw new InputError(`${path}: encoding must be "float64-le", got ${JSON.stringify(header.encoding)}`, { where: `${path}:encoding` });
  if (typeof header.values !== 'string') throw new InputError(`${path}: values must name the data file`, { where: `${path}:values` });
  const mesh = checkMesh({ n: Number(header.n), boxSize: Number(header.boxSize) }, path);
  const dataPath = join(dirname(path), header.values);
  let buf: Buffer;
  try {
    buf = readFileSync(dataPath);
  } catch (e) {
    throw new InputError(`${dataPath}: cannot read the mesh values (${(e as Error).message})`, { where: dataPath });
  }
  if (buf.length !== 8 * mesh.n ** 3) throw new InputError(`${dataPath}: holds ${buf.length} bytes, a ${mesh.n}^3 float64 mesh needs ${8 * mesh.n ** 3}`, { where: dataPath });
  const values = new Float64Array(mesh.n ** 3);
  for (let i = 0; i < values.length; i++) values[i] = buf.readDoubleLE(8 * i);
  const about: Record<string, number> = {};
  for (const [k, v] of Object.entries(header)) if (typeof v === 'number' && k !== 'n' && k !== 'boxSize') about[k] = v;
  const c = header.cosmology;
  let cosmology: Record<string, number> | undefined;
  if (c !== undefined) {
    if (typeof c !== 'object' || c === null || Array.isArray(c) || Object.values(c).some((v) => typeof v !== 'number')) {
      throw new InputError(`${path}: cosmology must be an object of named numbers`, { where: `${path}:cosmology` });
    }
    cosmology = c as Record<string, number>;
  }
  return { mesh, values, about, cosmology };
}
