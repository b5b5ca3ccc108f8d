import { afterEach, beforeEach, vi } from 'vitest';

// A stray console.error is a bug we did not notice; make it fail the test that caused it.
let errors: unknown[][] = [];

beforeEach(() => {
  errors = [];
  vi.spyOn(console, 'error').mockImplementation((...args: unknown[]) => {
    errors.push(args);
  });
});

afterEach(() => {
  vi.restoreAllMocks();
  if (errors.length > 0) {
    const first = errors[0]!.map(String).join(' ');
    throw new Error(`console.error was called ${errors.length} time(s); first: ${first}`);
  }
});
