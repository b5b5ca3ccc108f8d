import { describe, expect, it } from 'vitest';
import type { Db } from '../../../backend/src/db/client';
import { preparedByShape } from '../../../backend/src/db/prepared-by-shape';

describe('preparedByShape', () => {
  it('builds once per shape and handle, keeps at most `limit` shapes and drops the least recently used', () => {
    const built: string[] = [];
    const query = preparedByShape(2, (s: { sort: string }) => s.sort, (_db, s) => {
      built.push(s.sort);
      return { sort: s.sort, serial: built.length };
    });
    const dbA = {} as Db;
    const dbB = {} as Db;
    expect(query(dbA, { sort: 'z' })).toEqual({ sort: 'z', serial: 1 });
    expect(query(dbA, { sort: 'z' }).serial).toBe(1);
    expect(query(dbB, { sort: 'z' }).serial).toBe(2);
    query(dbA, { sort: 'snr' });
    // 'z' used last, so the third shape pushes out 'snr'.
    query(dbA, { sort: 'z' });
    query(dbA, { sort: 'class' });
    expect(query(dbA, { sort: 'z' }).serial).toBe(1);
    expect(query(dbA, { sort: 'snr' }).serial).toBe(5);
    expect(built).toEqual(['z', 'z', 'snr', 'class', 'snr']);
  });
});
