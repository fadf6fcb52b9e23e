import { mkdtemp, readdir, readFile, rm, writeFile, mkdir } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { writeOutputs } from '../../src/report/writeFiles.js';

let root = '';
beforeEach(async () => {
  root = await mkdtemp(join(tmpdir(), 'branchtrace-write-'));
});
afterEach(async () => {
  await rm(root, { recursive: true, force: true });
});

describe('writeOutputs', () => {
  it('creates the directory, writes every file and leaves no temporary file', async () => {
    const dir = join(root, 'a', 'b');
    await writeOutputs(dir, [{ name: 'report.md', content: '# hi\n' }, { name: 'points.csv', content: 'x\r\n1\r\n' }]);
    expect((await readdir(dir)).sort()).toEqual(['points.csv', 'report.md']);
    expect(await readFile(join(dir, 'report.md'), 'utf8')).toBe('# hi\n');
  });

  it('replaces an existing file completely', async () => {
    await writeFile(join(root, 'report.md'), 'old and longer content');
    await writeOutputs(root, [{ name: 'report.md', content: 'new' }]);
    expect(await readFile(join(root, 'report.md'), 'utf8')).toBe('new');
  });

  it('leaves an existing file untouched and removes temporary files when a write fails', async () => {
    await writeFile(join(root, 'report.md'), 'old');
    // A directory where a file should go makes the rename of that file fail.
    await mkdir(join(root, 'diagram.html'));
    await writeFile(join(root, 'diagram.html', 'inside'), 'x');
    await expect(writeOutputs(root, [
      { name: 'diagram.html', content: '<html>' }, { name: 'report.md', content: 'new' },
    ])).rejects.toThrow();
    expect(await readFile(join(root, 'report.md'), 'utf8')).toBe('old');
    expect((await readdir(root)).sort()).toEqual(['diagram.html', 'report.md']);
  });

  it('refuses names with directories in them', async () => {
    await expect(writeOutputs(root, [{ name: '../escape.txt', content: 'x' }])).rejects.toThrow(/plain file name/);
    expect(await readdir(root)).toEqual([]);
  });
});
