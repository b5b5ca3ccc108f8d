import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import Database from 'better-sqlite3';
import { drizzle } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { afterAll, describe, expect, it } from 'vitest';
import { openDatabase } from '../../backend/src/db/client';
import { campaigns, confirmedRedshifts, readings } from '../../backend/src/db/schema';

// A database made before grade codes were words (migrations up to 0007), with a campaign on the
// old 4 … 0 scheme, readings, a confirmed value and a disagreement that reference them. Opening
// it migrates the grade columns to text; the campaign's scheme must come out as it went in.
const drizzleDir = fileURLToPath(new URL('../../drizzle', import.meta.url));
const work = mkdtempSync(path.join(tmpdir(), 'redward-grades-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

const OLD_SCHEME = [
  { code: 4, label: 'firm', meaning: 'Two or more clear features.' },
  { code: 3, label: 'probable', meaning: 'One clear feature plus support.' },
  { code: 0, label: 'unusable', meaning: 'No usable signal.' },
];

function databaseBeforeWordCodes(file: string) {
  const folder = path.join(work, 'drizzle-0007');
  cpSync(drizzleDir, folder, { recursive: true });
  const journalFile = path.join(folder, 'meta', '_journal.json');
  const journal = JSON.parse(readFileSync(journalFile, 'utf8')) as { entries: Array<{ tag: string }> };
  journal.entries = journal.entries.filter((e) => e.tag <= '0007');
  writeFileSync(journalFile, JSON.stringify(journal));
  const sqlite = new Database(file);
  sqlite.pragma('foreign_keys = ON');
  migrate(drizzle(sqlite), { migrationsFolder: folder });
  const run = (sql: string, ...args: unknown[]) => sqlite.prepare(sql).run(...args);
  run(`insert into users (email, name, password_hash) values ('a@x.test', 'A', 'h'), ('b@x.test', 'B', 'h')`);
  run(`insert into campaigns (name, grade_scheme) values ('Old', ?)`, JSON.stringify(OLD_SCHEME));
  run(`insert into stored_files (sha256, size_bytes) values ('aa', 1), ('bb', 1)`);
  run(`insert into spectra (campaign_id, sha256, file_name, medium, pixels, wavelength_min, wavelength_max, errors_estimated) values (1, 'aa', 'one.fits', 'vacuum', 10, 4000, 9000, 0), (1, 'bb', 'two.fits', 'vacuum', 10, 4000, 9000, 0)`);
  run(`insert into readings (spectrum_id, reader_id, reading_order, z, grade, spectrum_class, lines) values (1, 1, 'first', 1.0, 4, 'galaxy', '[]'), (1, 2, 'second', 1.0, 3, 'galaxy', '[]'), (2, 1, 'first', 2.0, 4, 'galaxy', '[]'), (2, 2, 'second', 0.5, 0, 'galaxy', '[]')`);
  run(`insert into confirmed_redshifts (spectrum_id, z, grade, spectrum_class, lines, method, first_reading_id, second_reading_id) values (1, 1.0, 3, 'galaxy', '[]', 'agreement', 1, 2)`);
  run(`insert into disagreements (spectrum_id, campaign_id, first_reading_id, second_reading_id, reasons) values (2, 1, 3, 4, '["z","grade"]')`);
  sqlite.close();
}

describe('migrating grade codes to text', () => {
  it('keeps old campaigns on their own scheme and their readings on its codes, references intact', () => {
    const file = path.join(work, 'old.sqlite');
    databaseBeforeWordCodes(file);
    const db = openDatabase(file);
    // The stored scheme is not rewritten: the same JSON, numbers and all.
    const raw = db.$client.prepare('select grade_scheme from campaigns where id = 1').get() as { grade_scheme: string };
    expect(JSON.parse(raw.grade_scheme)).toEqual(OLD_SCHEME);
    // Read through the schema, its codes are the same digits as text.
    expect(db.select().from(campaigns).get()!.gradeScheme.map((g) => [g.code, g.label])).toEqual([['4', 'firm'], ['3', 'probable'], ['0', 'unusable']]);
    expect(db.select({ grade: readings.grade }).from(readings).all().map((r) => r.grade)).toEqual(['4', '3', '4', '0']);
    expect(db.select({ grade: confirmedRedshifts.grade, first: confirmedRedshifts.firstReadingId }).from(confirmedRedshifts).get()).toEqual({ grade: '3', first: 1 });
    expect(db.$client.prepare('select typeof(grade) as t from readings limit 1').get()).toEqual({ t: 'text' });
    expect(db.$client.pragma('foreign_key_check')).toEqual([]);
    expect(db.$client.pragma('foreign_keys', { simple: true })).toBe(1);
    db.$client.close();
  });
});
