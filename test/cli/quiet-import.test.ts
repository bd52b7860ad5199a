import { spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, statSync, writeFileSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { pathToFileURL } from 'node:url';
import { describe, expect, it } from 'vitest';

const root = new URL('../../', import.meta.url).pathname;
const tsxApi = pathToFileURL(join(root, 'node_modules/tsx/dist/esm/api/index.mjs')).href;

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return sourceFiles(path);
    return /\.(ts|tsx)$/.test(name) && !name.endsWith('.d.ts') ? [path] : [];
  });
}

describe('importing Plumbline', () => {
  it('prints nothing and reads no .env file, for every module under src/ and views/', () => {
    const dir = mkdtempSync(join(tmpdir(), 'plumbline-quiet-'));
    writeFileSync(join(dir, '.env'), 'PLUMBLINE_DOTENV_PROBE=loaded\n');
    const modules = [...sourceFiles(join(root, 'src')), ...sourceFiles(join(root, 'views'))];
    const script = `
      import fs from 'node:fs';
      const touched = [];
      for (const name of ['readFileSync', 'openSync', 'existsSync', 'statSync']) {
        const original = fs[name];
        fs[name] = function (path, ...rest) {
          if (String(path).endsWith('.env')) touched.push(name + ' ' + String(path));
          return original.call(this, path, ...rest);
        };
      }
      const { register } = await import(${JSON.stringify(tsxApi)});
      register({ tsconfig: ${JSON.stringify(join(root, 'tsconfig.json'))} });
      for (const m of ${JSON.stringify(modules)}) await import(new URL('file://' + m).href);
      fs.writeFileSync(${JSON.stringify(join(dir, 'report.json'))}, JSON.stringify({ touched, probe: process.env.PLUMBLINE_DOTENV_PROBE ?? null }));
    `;
    writeFileSync(join(dir, 'probe.mjs'), script);
    const run = spawnSync(process.execPath, ['probe.mjs'], { cwd: dir, encoding: 'utf8' });
    expect(run.stderr).toBe('');
    expect(run.stdout).toBe('');
    expect(run.status).toBe(0);
    const report = JSON.parse(readFileSync(join(dir, 'report.json'), 'utf8'));
    expect(report).toEqual({ touched: [], probe: null });
    expect(modules.length).toBeGreaterThan(20);
  });

  it('never imports the root of `natural` (it loads .env and prints), only its submodules', () => {
    const offenders = sourceFiles(join(root, 'src'))
      .filter((f) => /from\s+['"]natural['"]|require\(\s*['"]natural['"]\s*\)|import\(\s*['"]natural['"]\s*\)/.test(readFileSync(f, 'utf8')))
      .map((f) => relative(root, f));
    expect(offenders).toEqual([]);
  });
});
