import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { lockOutputFolder } from '../../../src/workflows/fit/output-lock.js';

const dir = mkdtempSync(join(tmpdir(), 'treble-lock-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('output-folder lock', () => {
  it('refuses a second writer while the first process lives, naming its pid', () => {
    writeFileSync(join(dir, 'fit.lock'), String(process.ppid)); // the parent process is alive
    expect(() => lockOutputFolder(dir)).toThrow(new RegExp(`another fit \\(process ${process.ppid}\\)`));
  });

  it('takes over a lock left by a dead process and releases it', () => {
    writeFileSync(join(dir, 'fit.lock'), '2147483646');
    const unlock = lockOutputFolder(dir);
    expect(existsSync(join(dir, 'fit.lock'))).toBe(true);
    unlock();
    expect(existsSync(join(dir, 'fit.lock'))).toBe(false);
  });
});
