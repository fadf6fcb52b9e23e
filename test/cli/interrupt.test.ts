/**
 * Ctrl-C during a long sweep: the CLI stops the trace at the next point, still writes every output
 * file with what it computed (marked as interrupted), and exits with status 130.
 */
import { spawn } from 'node:child_process';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { expect, it } from 'vitest';
import { tempDir } from './runCli.js';

/** 1-D Bratu problem u'' + λe^u = 0 by central differences on 80 interior points (a slow sweep on purpose). */
function bratuModel(n: number): string {
  const lines = ['title: Bratu problem, finite differences', 'about: demo only; Bratu (1914) problem used as a slow test', 'states:'];
  for (let i = 0; i < n; i++) lines.push(`  u${i}: 0`);
  lines.push('parameters:', '  lam: 0.1', 'equations:');
  const h2 = (n + 1) ** 2;
  for (let i = 0; i < n; i++) {
    const left = i > 0 ? `u${i - 1}` : '0';
    const right = i < n - 1 ? `u${i + 1}` : '0';
    lines.push(`  u${i}: (${left} - 2*u${i} + ${right})*${h2} + lam*exp(u${i})`);
  }
  return lines.join('\n') + '\n';
}

it('SIGINT keeps the computed part, marks it interrupted and exits with 130', async () => {
  const dir = tempDir('interrupt');
  const model = join(dir, 'bratu.yaml');
  writeFileSync(model, bratuModel(80));
  const out = join(dir, 'out');
  const child = spawn(process.execPath, [
    join(process.cwd(), 'dist/cli.js'), 'sweep', model, '--vary', 'lam', '--from', '0.1', '--to', '3.4',
    '--max-step', '0.0005', '--step', '0.0005', '--max-points', '1000000', '--out', out, '--progress',
  ], { stdio: ['ignore', 'pipe', 'pipe'] });
  // Interrupt once the trace has taken at least 20 steps (so the test does not depend on machine speed).
  let stderr = '';
  let sent = false;
  child.stderr.on('data', (d: Buffer) => {
    stderr += d.toString();
    const counts = [...stderr.matchAll(/sweeping: branch \d+, (\d+) points?/g)].map((m) => Number(m[1]));
    if (!sent && counts.some((c) => c >= 20)) {
      sent = true;
      child.kill('SIGINT');
    }
  });
  const status = await new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
  expect(sent, stderr).toBe(true);
  expect(status, stderr).toBe(130);
  const report = JSON.parse(readFileSync(join(out, 'report.json'), 'utf8')) as {
    interrupted: boolean; branches: { stopped: string; points: unknown[] }[];
  };
  expect(report.interrupted).toBe(true);
  expect(report.branches.some((b) => b.stopped === 'interrupted')).toBe(true);
  expect(report.branches[0]!.points.length).toBeGreaterThan(1);
  for (const f of ['report.md', 'points.csv', 'diagram.html']) expect(existsSync(join(out, f)), f).toBe(true);
  expect(readFileSync(join(out, 'report.md'), 'utf8')).toMatch(/interrupted/i);
});
