import { EventEmitter } from 'node:events';
import type { NextFunction, Request, Response } from 'express';
import { describe, expect, it } from 'vitest';
import { requestActivity } from '../../../backend/src/http/request-activity';

const fakeRes = () => new EventEmitter() as unknown as Response;

describe('requestActivity', () => {
  it('is busy while a person’s request is answered and shortly after; a scan worker’s request does not count', async () => {
    await new Promise((r) => setTimeout(r, 30));
    expect(requestActivity.busy(20)).toBe(false);
    const worker = fakeRes();
    let nexts = 0;
    const next: NextFunction = () => void (nexts += 1);
    requestActivity.middleware({ path: '/worker/items/1/result' } as Request, worker, next);
    expect(requestActivity.busy(20)).toBe(false);
    const res = fakeRes();
    requestActivity.middleware({ path: '/me/queue' } as Request, res, next);
    expect(nexts).toBe(2);
    expect(requestActivity.busy(20)).toBe(true);
    (res as unknown as EventEmitter).emit('finish');
    (res as unknown as EventEmitter).emit('close'); // counted once
    expect(requestActivity.busy(20)).toBe(true); // just ended
    await new Promise((r) => setTimeout(r, 30));
    expect(requestActivity.busy(20)).toBe(false);
    // Had the ended request been counted off twice, this one would not count as in flight.
    const slow = fakeRes();
    requestActivity.middleware({ path: '/spectra/1' } as Request, slow, next);
    await new Promise((r) => setTimeout(r, 30));
    expect(requestActivity.busy(20)).toBe(true);
    (slow as unknown as EventEmitter).emit('close');
  });
});
