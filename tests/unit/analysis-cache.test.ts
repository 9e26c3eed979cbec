import { describe, expect, it } from 'vitest';
import { AnalysisCache } from '../../server/modules/analysis/analysis-cache';

const json = (assignmentId: number, dataRevision: number) => JSON.stringify({ assignmentId, dataRevision });

describe('AnalysisCache', () => {
  it('returns the stored JSON for the same assignment and revision', () => {
    const cache = new AnalysisCache();
    cache.set(7, 3, json(7, 3));
    expect(cache.get(7, 3)).toBe(json(7, 3));
    expect(cache.get(7, 3)).toBe(json(7, 3)); // a hit does not consume the entry
  });

  it('never returns an entry for another revision or another assignment', () => {
    const cache = new AnalysisCache();
    cache.set(7, 3, json(7, 3));
    expect(cache.get(7, 4)).toBeUndefined();
    expect(cache.get(7, 2)).toBeUndefined();
    expect(cache.get(8, 3)).toBeUndefined();
  });

  it('drops an assignment’s older revision when a newer one is stored', () => {
    const cache = new AnalysisCache();
    cache.set(7, 3, json(7, 3));
    cache.set(7, 4, json(7, 4));
    expect(cache.get(7, 3)).toBeUndefined();
    expect(cache.get(7, 4)).toBe(json(7, 4));
  });

  it('keeps the newer revision when a computation of an older one finishes after it', () => {
    const cache = new AnalysisCache();
    cache.set(7, 4, json(7, 4)); // the computation after an edit finished first
    cache.set(7, 3, json(7, 3)); // the one started before the edit finishes later
    expect(cache.get(7, 4)).toBe(json(7, 4));
    expect(cache.get(7, 3)).toBeUndefined();
  });

  it('keeps assignments apart whose ids share leading digits (1 and 11)', () => {
    const cache = new AnalysisCache();
    cache.set(1, 5, json(1, 5));
    cache.set(11, 5, json(11, 5));
    cache.set(11, 6, json(11, 6));
    cache.set(21, 1, json(21, 1));
    expect(cache.get(1, 5)).toBe(json(1, 5));
    expect(cache.get(11, 6)).toBe(json(11, 6));
    expect(cache.get(21, 1)).toBe(json(21, 1));
  });

  it('evicts the least recently used entry when full, where a read counts as a use', () => {
    const cache = new AnalysisCache(2);
    cache.set(1, 1, json(1, 1));
    cache.set(2, 1, json(2, 1));
    expect(cache.get(1, 1)).toBe(json(1, 1)); // 1 is now more recent than 2
    cache.set(3, 1, json(3, 1));
    expect(cache.get(2, 1)).toBeUndefined();
    expect(cache.get(1, 1)).toBe(json(1, 1));
    expect(cache.get(3, 1)).toBe(json(3, 1));

    cache.set(4, 1, json(4, 1)); // 3 was read after 1, so 1 is now the least recently used
    expect(cache.get(1, 1)).toBeUndefined();
    expect(cache.get(3, 1)).toBe(json(3, 1));
    expect(cache.get(4, 1)).toBe(json(4, 1));
  });

  it('clear() empties it', () => {
    const cache = new AnalysisCache();
    cache.set(7, 3, json(7, 3));
    cache.clear();
    expect(cache.get(7, 3)).toBeUndefined();
  });
});
