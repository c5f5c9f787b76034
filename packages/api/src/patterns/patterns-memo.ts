import { Injectable } from '@nestjs/common';
import type { computePatterns, Patterns } from '@workback/core';
import { LRUCache } from 'lru-cache';
import { contentDigest } from '../common/content-digest.js';
import { CpuPool } from '../workers/cpu-pool.service.js';

type Options = Parameters<typeof computePatterns>[1];

/**
 * `computePatterns` remembered by the digest of its inputs. The maths is a pure function of
 * the misses, the right items, the plans, the day and the range, and weighing findings against
 * every right item is most of a patterns request; the rows are still read each time, so a new
 * miss, mark or plan changes the digest and is counted at once. At most MAX_ENTRIES results.
 * The maths runs in a worker thread (CpuPool); requests for the same inputs at once share it.
 */
@Injectable()
export class PatternsMemo {
  static readonly MAX_ENTRIES = 500;
  private readonly results = new LRUCache<string, Promise<Patterns>>({
    max: PatternsMemo.MAX_ENTRIES,
  });

  constructor(private readonly cpu: CpuPool) {}

  compute(misses: Parameters<typeof computePatterns>[0], options: Options): Promise<Patterns> {
    const key = contentDigest([misses, options]);
    const kept = this.results.get(key);
    if (kept) return kept;
    const patterns = this.cpu.patterns(misses, options);
    this.results.set(key, patterns);
    // A failure (the pool busy, say) is not remembered: the next request tries again.
    patterns.catch(() => {
      if (this.results.get(key) === patterns) this.results.delete(key);
    });
    return patterns;
  }
}
