import { closeSync, openSync, readFileSync, rmSync, writeSync } from 'node:fs';
import { join } from 'node:path';
import { InputError } from '../../contracts/input-error.js';

/**
 * One fit at a time per output folder: `fit.lock` holds the pid of the process
 * that writes there. A second process is refused while that pid is alive; a
 * lock left by a process that died (kill -9) is taken over.
 */
const LOCK_FILE = 'fit.lock';

function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM';
  }
}

export function lockOutputFolder(folder: string): () => void {
  const path = join(folder, LOCK_FILE);
  for (let attempt = 0; attempt < 2; attempt++) {
    try {
      const fd = openSync(path, 'wx');
      writeSync(fd, String(process.pid));
      closeSync(fd);
      return () => rmSync(path, { force: true });
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code !== 'EEXIST') throw e;
      const pid = Number(readFileSync(path, 'utf8'));
      if (Number.isInteger(pid) && pid > 0 && pid !== process.pid && alive(pid)) {
        throw new InputError(`${folder}: another fit (process ${pid}) is writing to this output folder`, { hint: 'wait for it to finish, or give this config another output folder' });
      }
      rmSync(path, { force: true });
    }
  }
  throw new InputError(`${folder}: cannot take the lock ${path}`);
}
