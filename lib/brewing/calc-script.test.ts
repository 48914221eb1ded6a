import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const PROJECT_ROOT = fileURLToPath(new URL('../..', import.meta.url));
const EXAMPLE_PATH = fileURLToPath(new URL('./examples/pale-ale.json', import.meta.url));

/** Runs `scripts/calc.ts` under tsx with `input` on stdin. */
function runCalc(input: string) {
  return spawnSync(process.execPath, ['--import', 'tsx', 'scripts/calc.ts'], {
    cwd: PROJECT_ROOT,
    input,
    encoding: 'utf8',
    timeout: 30_000,
  });
}

describe('scripts/calc.ts', () => {
  it('prints the stats of a valid recipe as JSON', () => {
    const result = runCalc(readFileSync(EXAMPLE_PATH, 'utf8'));
    expect(result.status, result.stderr).toBe(0);
    const stats = JSON.parse(result.stdout);
    expect(stats.og).toBeGreaterThan(1.04);
    expect(stats.hops).toHaveLength(4);
    expect(stats.styleFit.code).toBe('18B');
  });

  it('exits with status 2 on input that is not JSON', () => {
    const result = runCalc('{ not json');
    expect(result.status).toBe(2);
    expect(result.stderr).toMatch(/not valid JSON/);
    expect(result.stdout).toBe('');
  });

  it('exits with status 2 and names each bad field on its own line', () => {
    const doc = JSON.parse(readFileSync(EXAMPLE_PATH, 'utf8'));
    doc.hops[2].alphaPct = 45;
    doc.batch.volumeL = 0;
    const result = runCalc(JSON.stringify(doc));
    expect(result.status).toBe(2);
    const lines = result.stderr.trim().split('\n');
    expect(lines).toContain('hops.2.alphaPct: Alpha acid must be at most 30%');
    expect(lines).toContain('batch.volumeL: Batch volume must be at least 0.1 L');
    expect(lines).toHaveLength(2);
  });
});
