import fs from 'node:fs';

const alive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};

/**
 * Takes the run lock (one `npm start` per checkout). Returns the holder's description when
 * another live process holds it, else undefined (and the lock is ours until release()).
 */
export function takeLock(file: string, description: string): { heldBy?: string; release: () => void } {
  for (let attempt = 0; attempt < 2; attempt++) {
    try {
      fs.writeFileSync(file, JSON.stringify({ pid: process.pid, description }), { flag: 'wx' });
      return { release: () => fs.rmSync(file, { force: true }) };
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw error;
      const holder = JSON.parse(fs.readFileSync(file, 'utf8') || '{}') as { pid?: number; description?: string };
      if (holder.pid && alive(holder.pid))
        return { heldBy: `pid ${holder.pid}, ${holder.description ?? ''}`, release: () => undefined };
      fs.rmSync(file, { force: true });
    }
  }
  throw new Error(`could not take the lock ${file}`);
}
