import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

// The committed demo folder (written by scripts/make-demo.ts): invented Harrow Flats data.
const DEMO = join(dirname(fileURLToPath(import.meta.url)), '..', '..', '..', 'demo');
const manifest = JSON.parse(readFileSync(join(DEMO, 'manifest.json'), 'utf8'));

function folderSize(dir: string): number {
  return readdirSync(dir).reduce((sum, name) => {
    const p = join(dir, name);
    return sum + (statSync(p).isDirectory() ? folderSize(p) : statSync(p).size);
  }, 0);
}

describe('demo folder', () => {
  it('should list files that exist and stay under 3 MB', () => {
    for (const t of manifest.tests) expect(existsSync(join(DEMO, t.file))).toBe(true);
    for (const b of manifest.broken) expect(existsSync(join(DEMO, b.file))).toBe(true);
    expect(existsSync(join(DEMO, manifest.logs[0].file))).toBe(true);
    expect(existsSync(join(DEMO, manifest.surveys[0].file))).toBe(true);
    expect(folderSize(DEMO)).toBeLessThan(3e6);
  });

  it('should cover every test type, six wells and every flaw', () => {
    const types = new Set(manifest.tests.map((t: { type: string }) => t.type));
    expect([...types].sort()).toEqual(['dfit', 'fit', 'lot', 'srt', 'xlot']);
    expect(new Set(manifest.tests.map((t: { well: string }) => t.well)).size).toBe(6);
    const flaws = new Set(manifest.tests.flatMap((t: { flaws: string[] }) => t.flaws));
    for (const f of ['airInLine', 'leakingShutIn', 'unsteadyRate', 'clippedGauge', 'reopening-above-breakdown', 'no-stable-shut-in', 'sparseSampling']) {
      expect(flaws.has(f)).toBe(true);
    }
  });

  it('should follow the stated invented stress field', () => {
    // README: Shmin = 1.0 MPa + 16.5 kPa/m x TVD, Pp = 10.0 kPa/m x TVD, Sv = 1 psi/ft (22.62 kPa/m).
    for (const t of manifest.tests) {
      const z = t.depthTvd.value;
      expect(t.truth.shmin).toBeCloseTo(1.0 + 0.0165 * z, 2);
      expect(t.truth.porePressure).toBeCloseTo(0.01 * z, 2);
      expect(t.truth.verticalStress / z).toBeCloseTo(0.02262, 4);
      // The mud column stays below Shmin, so every test needs surface pressure to fracture.
      expect(t.truth.mudColumn).toBeLessThan(t.truth.shmin);
    }
  });

  it('should say in the README that the data are invented', () => {
    const readme = readFileSync(join(DEMO, 'README.md'), 'utf8');
    expect(readme).toContain('Everything in this folder is invented');
    expect(readme).toContain('qualified engineer');
  });
});
