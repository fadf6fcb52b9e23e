import { randomBytes } from 'node:crypto';
import { mkdir, rename, rm, writeFile } from 'node:fs/promises';
import { basename, join } from 'node:path';

export interface OutputFile {
  /** A plain file name (no directories). */
  name: string;
  content: string;
}

/**
 * Write the output files into `dir` (created if missing) so that each file is either its old self or
 * completely new: every file is first written to a temporary file in the same directory, and only when
 * all are written are they renamed into place (a rename within a directory is atomic). On any failure
 * the temporary files are removed and the error is rethrown; files already renamed stay complete.
 * This is the only module of branchtrace that writes to the file system.
 */
export async function writeOutputs(dir: string, files: readonly OutputFile[]): Promise<string[]> {
  for (const f of files) {
    if (f.name === '' || basename(f.name) !== f.name || f.name === '.' || f.name === '..') {
      throw new Error(`output file name "${f.name}" must be a plain file name`);
    }
  }
  await mkdir(dir, { recursive: true });
  const tag = `${process.pid}-${randomBytes(4).toString('hex')}`;
  const temps = files.map((f) => join(dir, `.${f.name}.${tag}.tmp`));
  const renamed = new Set<number>();
  try {
    await Promise.all(files.map((f, i) => writeFile(temps[i]!, f.content, { encoding: 'utf8', flag: 'wx' })));
    const targets: string[] = [];
    for (const [i, f] of files.entries()) {
      const target = join(dir, f.name);
      await rename(temps[i]!, target);
      renamed.add(i);
      targets.push(target);
    }
    return targets;
  } catch (err) {
    await Promise.all(temps.filter((_, i) => !renamed.has(i)).map((t) => rm(t, { force: true })));
    throw err;
  }
}
