export interface SpectrumToAssign {
  spectrumId: number;
  /** Target priority, 1 = most wanted; null sorts last. */
  priority: number | null;
  first: number | null;
  second: number | null;
}

export interface PlannedAssignment {
  spectrumId: number;
  readerId: number;
  readingOrder: 'first' | 'second';
}

/**
 * Gives every spectrum two different readers, priority targets first, each time to the reader
 * with the fewest assignments so far (existing ones included), ties to the lower user id.
 * Existing assignments are kept. Pure: the service applies the plan in one transaction.
 *
 * @example planAssignments([{spectrumId: 1, priority: 1, first: null, second: null}], [7, 9], new Map())
 *   // [{spectrumId: 1, readerId: 7, readingOrder: 'first'}, {spectrumId: 1, readerId: 9, readingOrder: 'second'}]
 */
export function planAssignments(spectra: readonly SpectrumToAssign[], readerIds: readonly number[], existingLoad: ReadonlyMap<number, number>): PlannedAssignment[] {
  const readers = [...new Set(readerIds)].sort((a, b) => a - b);
  if (readers.length < 2) throw new RangeError('Two different readers are needed for blind double reading.');
  const load = new Map(readers.map((r) => [r, existingLoad.get(r) ?? 0]));
  const leastLoaded = (exclude: number | null) =>
    readers.filter((r) => r !== exclude).reduce((best, r) => (load.get(r)! < load.get(best)! ? r : best), readers.find((r) => r !== exclude)!);

  const ordered = [...spectra].sort((a, b) => (a.priority ?? Infinity) - (b.priority ?? Infinity) || a.spectrumId - b.spectrumId);
  const plan: PlannedAssignment[] = [];
  for (const s of ordered) {
    let first = s.first;
    if (first === null) {
      first = leastLoaded(s.second);
      plan.push({ spectrumId: s.spectrumId, readerId: first, readingOrder: 'first' });
      load.set(first, load.get(first)! + 1);
    }
    if (s.second === null) {
      const second = leastLoaded(first);
      plan.push({ spectrumId: s.spectrumId, readerId: second, readingOrder: 'second' });
      load.set(second, load.get(second)! + 1);
    }
  }
  return plan;
}
