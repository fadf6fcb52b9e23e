/** Runs the bundled CLI (built by test/setup/buildOnce.ts) and returns what it printed. */
import { spawnSync } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export interface CliRun {
  status: number | null;
  stdout: string;
  stderr: string;
}

export function runCli(args: readonly string[], cwd = process.cwd()): CliRun {
  const r = spawnSync(process.execPath, [join(process.cwd(), "dist/cli.js"), ...args], { cwd, encoding: 'utf8' });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

export function tempDir(prefix: string): string {
  return mkdtempSync(join(tmpdir(), `branchtrace-${prefix}-`));
}

/** The error contract: one line starting with "branchtrace: ", no stack trace. */
export function oneLineError(r: CliRun): string {
  const lines = r.stderr.split('\n').filter((l) => l !== '');
  if (lines.length !== 1 || !lines[0]!.startsWith('branchtrace: ') || /\n\s+at /.test(r.stderr)) {
    throw new Error(`expected one error line, got:\n${r.stderr}`);
  }
  return lines[0]!;
}
