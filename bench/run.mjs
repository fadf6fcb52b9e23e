// Benchmarks: `npm run bench` (= npm run build && node bench/run.mjs).
//
// Bundles every bench/*Bench.ts with esbuild into out/bench/*.mjs, runs them one after the other
// in child processes (each calls the module's main()), collects the JSON lines they print
// (bench/benchOutput.ts), prints one plain-text table per benchmark with the machine facts the
// numbers depend on, and writes everything to out/bench/results.json.
//
// Usage: node bench/run.mjs [NAME ...]     NAME filters by file name, e.g. `node bench/run.mjs compile`
import { build } from 'esbuild';
import { spawn } from 'node:child_process';
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { cpus, loadavg } from 'node:os';
import { basename, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const outDir = join(root, 'out', 'bench');
/** Order of the tables; files not listed run afterwards in name order. */
const ORDER = ['compileBench', 'sweepCostBench', 'cliSweepBench', 'userScriptBench'];
const CHILD_TIMEOUT_MS = 150_000;

function cpuModel() {
  try {
    const line = readFileSync('/proc/cpuinfo', 'utf8').split('\n').find((l) => l.startsWith('model name'));
    if (line) return line.split(':')[1].trim();
  } catch { /* not Linux */ }
  return cpus()[0]?.model ?? 'unknown';
}

const machine = {
  node: process.version,
  cpu: cpuModel(),
  cores: cpus().length,
  platform: `${process.platform} ${process.arch}`,
  /** 1-minute load average when the run started: other work on the machine slows every number. */
  loadAtStart: loadavg()[0],
};

async function bundle(name) {
  const outfile = join(outDir, `${name}.mjs`);
  await build({
    stdin: {
      contents: `import { main } from './${name}.ts'; await main();`,
      resolveDir: join(root, 'bench'),
      sourcefile: `${name}-entry.ts`,
      loader: 'ts',
    },
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    external: ['vega', 'vega-lite'],
    banner: { js: "import { createRequire as __btCreateRequire } from 'node:module'; const require = __btCreateRequire(import.meta.url);" },
    define: { __BRANCHTRACE_VERSION__: JSON.stringify('bench') },
    logLevel: 'warning',
    outfile,
  });
  return outfile;
}

function runChild(file) {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [file], { cwd: root, stdio: ['ignore', 'pipe', 'inherit'] });
    const lines = [];
    const passthrough = [];
    let buffer = '';
    child.stdout.on('data', (chunk) => {
      buffer += chunk;
      let nl;
      while ((nl = buffer.indexOf('\n')) >= 0) {
        const line = buffer.slice(0, nl);
        buffer = buffer.slice(nl + 1);
        let parsed = null;
        if (line.startsWith('{')) {
          try { parsed = JSON.parse(line); } catch { parsed = null; }
        }
        if (parsed && typeof parsed.table === 'string') lines.push(parsed);
        else passthrough.push(line);
      }
    });
    const timer = setTimeout(() => child.kill('SIGTERM'), CHILD_TIMEOUT_MS);
    child.on('close', (code, signal) => {
      clearTimeout(timer);
      if (buffer) passthrough.push(buffer);
      resolve({ code, signal, lines, passthrough });
    });
  });
}

function collect(lines, tables) {
  for (const line of lines) {
    let t = tables.get(line.table);
    if (!t) tables.set(line.table, (t = { id: line.table, title: line.table, rows: [], notes: [], facts: [] }));
    if (line.title && t.title === t.id) t.title = line.title;
    if (line.row) t.rows.push(line.row);
    if (line.note) t.notes.push(line.note);
    if (line.fact) t.facts.push(line.fact);
  }
}

function formatTable(t) {
  const columns = [];
  for (const row of t.rows) for (const key of Object.keys(row)) if (!columns.includes(key)) columns.push(key);
  const cells = t.rows.map((row) => columns.map((c) => (row[c] === undefined ? '' : String(row[c]))));
  const width = columns.map((c, j) => Math.max(c.length, ...cells.map((r) => r[j].length)));
  const numeric = columns.map((_, j) => cells.every((r) => r[j] === '' || /^[-+<>≤≥ ]*[0-9.e+-]+[×%]?$/.test(r[j])));
  const pad = (text, j) => (numeric[j] ? text.padStart(width[j]) : text.padEnd(width[j]));
  const out = [
    t.title,
    `machine: node ${machine.node}, CPU ${machine.cpu} (${machine.cores} logical cores), ${machine.platform}, ` +
      `load average ${machine.loadAtStart.toFixed(2)} at start`,
    ...t.facts.map((f) => `         ${f}`),
    '',
    columns.map(pad).join('  ').trimEnd(),
    width.map((w) => '-'.repeat(w)).join('  '),
    ...cells.map((r) => r.map(pad).join('  ').trimEnd()),
  ];
  if (t.notes.length) out.push('', ...t.notes.map((n) => `  * ${n}`));
  return out.join('\n');
}

const filters = process.argv.slice(2);
const names = readdirSync(join(root, 'bench'))
  .filter((f) => /Bench\.ts$/.test(f))
  .map((f) => basename(f, '.ts'))
  .filter((n) => filters.length === 0 || filters.some((f) => n.toLowerCase().includes(f.toLowerCase())))
  .sort((a, b) => {
    const ia = ORDER.indexOf(a), ib = ORDER.indexOf(b);
    return (ia < 0 ? ORDER.length : ia) - (ib < 0 ? ORDER.length : ib) || a.localeCompare(b);
  });

mkdirSync(outDir, { recursive: true });
const tables = new Map();
const failures = [];
const started = performance.now();
for (const name of names) {
  process.stderr.write(`bench: ${name} ...\n`);
  const t0 = performance.now();
  let result;
  try {
    result = await runChild(await bundle(name));
  } catch (error) {
    failures.push({ bench: name, error: String(error) });
    continue;
  }
  collect(result.lines, tables);
  for (const line of result.passthrough) if (line.trim()) console.log(line);
  const seconds = ((performance.now() - t0) / 1000).toFixed(1);
  if (result.code !== 0) {
    const why = result.signal ? `killed by ${result.signal}` : `exit code ${result.code}`;
    failures.push({ bench: name, error: why });
    process.stderr.write(`bench: ${name} failed (${why}) after ${seconds} s\n`);
  } else {
    process.stderr.write(`bench: ${name} done in ${seconds} s\n`);
  }
}

for (const t of tables.values()) console.log(`\n${formatTable(t)}`);
if (failures.length) {
  console.log('\nFailed benchmarks:');
  for (const f of failures) console.log(`  ${f.bench}: ${f.error}`);
}
const total = (performance.now() - started) / 1000;
// A filtered run writes beside the full results instead of replacing them.
const resultsFile = filters.length ? 'results-partial.json' : 'results.json';
console.log(`\nTotal bench time ${total.toFixed(1)} s. Results: out/bench/${resultsFile}`);
writeFileSync(
  join(outDir, resultsFile),
  JSON.stringify({ date: new Date().toISOString(), machine, seconds: total, tables: [...tables.values()], failures }, null, 2) + '\n',
);
process.exitCode = failures.length ? 1 : 0;
