import { execFile } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { describe, expect, it } from 'vitest';
import { loadShippedFilters, loadShippedTemplates } from '../../../backend/src/cli/photoz-data';
import { buildModelGrid, redshiftGrid } from '../../../backend/src/photoz/modelGrid';

const run = promisify(execFile);

/** `npm run photoz -- …` without npm's banner: the same script under tsx. */
async function photoz(args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  try {
    const { stdout, stderr } = await run(process.execPath, ['--import', 'tsx', 'backend/src/cli/photoz.ts', ...args], { timeout: 60_000 });
    return { code: 0, stdout, stderr };
  } catch (e) {
    const err = e as { code: number; stdout: string; stderr: string };
    return { code: err.code, stdout: err.stdout, stderr: err.stderr };
  }
}

const bands = ['acs_wfc_f435w', 'acs_wfc_f606w', 'acs_wfc_f775w', 'acs_wfc_f850lp', 'wfc3_ir_f125w', 'wfc3_ir_f160w'];
const dir = mkdtempSync(join(tmpdir(), 'redward-photoz-cli-'));
const csv = (name: string, lines: string[]) => {
  const p = join(dir, name);
  writeFileSync(p, lines.join('\n') + '\n');
  return p;
};
const header = ['id', ...bands.flatMap((b) => [`flux_${b}`, `err_${b}`])].join(',');

// Each case spawns tsx (≈ 1 s each on a quiet machine, several on the shared CI host).
describe('npm run photoz (CLI)', { timeout: 60_000 }, () => {
  // Fluxes of shipped templates through the same bands: a z ≈ 6 dropout and an M5 dwarf, 100 nJy at peak, 2 nJy errors.
  const grid = buildModelGrid(loadShippedTemplates(), loadShippedFilters(bands), redshiftGrid());
  const nz = grid.redshift.z.length;
  const k6 = grid.redshift.z.findIndex((z) => z >= 6);
  const t = grid.galaxyIds.indexOf('lbg-beta-2.0');
  const lbg = Array.from(grid.galaxy.subarray((t * nz + k6) * bands.length, (t * nz + k6 + 1) * bands.length));
  const s = grid.starIds.indexOf('star-M4');
  const star = Array.from(grid.star.subarray(s * bands.length, (s + 1) * bands.length));
  const row = (id: string, f: number[]) => [id, ...f.flatMap((v) => [((100 * v) / Math.max(...f)).toFixed(4), '2'])].join(',');
  const good = csv('good.csv', [header, row('dropout', lbg), row('dwarf', star)]);

  it('prints one JSON line per source with the documented keys; a dropout and a dwarf', async () => {
    const r = await photoz([good, '--json']);
    expect(r.code).toBe(0);
    const lines = r.stdout.trim().split('\n').map((l) => JSON.parse(l));
    expect(lines).toHaveLength(2);
    expect(Object.keys(lines[0])).toEqual(['id', 'z', 'z68', 'z95', 'pLowZ', 'class', 'starChi2', 'galaxyChi2']);
    expect(lines[0].id).toBe('dropout');
    expect(Math.abs(lines[0].z - grid.redshift.z[k6]!)).toBeLessThan(0.05);
    expect(lines[0].class).toBe('galaxy');
    expect(lines[0].pLowZ).toBeLessThan(0.01);
    expect(lines[0].z95[0]).toBeLessThanOrEqual(lines[0].z68[0]);
    expect(lines[0].z68[1]).toBeLessThanOrEqual(lines[0].z95[1]);
    expect(lines[1]).toMatchObject({ id: 'dwarf', class: 'star' });
    expect(lines[1].starChi2).toBeLessThan(lines[1].galaxyChi2);
  });

  it('names an unknown filter column and exits 2 with a usage line', async () => {
    const p = csv('unknown.csv', ['id,flux_wfc3_ir_f999w,err_wfc3_ir_f999w', 'a,1,1']);
    const r = await photoz([p, '--json']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/^Usage: npm run photoz/);
    expect(r.stderr).toMatch(/column "flux_wfc3_ir_f999w": unknown filter "wfc3_ir_f999w"/);
  });

  it('names a missing error column', async () => {
    const p = csv('noerr.csv', ['id,flux_wfc3_ir_f160w', 'a,1']);
    const r = await photoz([p]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/"flux_wfc3_ir_f160w" has no error column "err_wfc3_ir_f160w"/);
  });

  it('names the column and line of a non-numeric cell', async () => {
    const p = csv('nan.csv', [header, row('ok', lbg), row('bad', lbg).replace(/,2$/, ',lots')]);
    const r = await photoz([p, '--json']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/line 3 \(id bad\), column err_wfc3_ir_f160w: "lots" is not a number/);
    expect(r.stdout).toBe('');
  });

  it('takes a campaign\'s own two-column curve with --curve and refuses a bad one by line', async () => {
    const curve = join(dir, 'box.txt');
    writeFileSync(curve, ['# a box filter', ...Array.from({ length: 11 }, (_, i) => `${14000 + 200 * i} ${i === 0 || i === 10 ? 0 : 0.5}`)].join('\n'));
    // β = −2 is flat in f_ν, so the box sees what F160W sees.
    const f160 = ((100 * lbg[5]!) / Math.max(...lbg)).toFixed(4);
    const p = csv('own.csv', [`${header},flux_box,err_box`, `${row('dropout', lbg)},${f160},2`]);
    const r = await photoz([p, '--json', '--curve', `box=${curve}`]);
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout).class).toBe('galaxy');
    writeFileSync(curve, '1000 0\n900 1\n');
    const bad = await photoz([p, '--curve', `box=${curve}`]);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toMatch(/box: line 2: wavelength 900 Å does not increase/);
  });

  it('exits 2 with a usage line on a bad option, no file or a missing file', async () => {
    for (const args of [[good, '--frobnicate'], [], [join(dir, 'missing.csv')], [good, '--threads', 'many']]) {
      const r = await photoz(args);
      expect(r.code).toBe(2);
      expect(r.stderr).toMatch(/^Usage: npm run photoz/);
    }
  });
});
