import { Injectable } from '@nestjs/common';
import { LRUCache } from 'lru-cache';
import { contentDigest } from '../common/content-digest.js';
import { CpuPool } from '../workers/cpu-pool.service.js';
import type { ReviewPlanJson } from './review-plans.service.js';

/**
 * A plan's PDF is a function of the plan as read (its items and ticks, misses, lesson titles,
 * student): the bytes are kept under the digest of that reading, so printing an unchanged plan
 * again costs a read and a hash, not a layout of every page. Whatever changes what the PDF
 * shows changes the digest, so a stale PDF is never answered; old entries fall out of the
 * cache (at most MAX_BYTES of PDFs in memory). Requests for one plan at once share a rendering,
 * which is laid out in a worker thread (CpuPool).
 */
@Injectable()
export class PlanPdfCache {
  static readonly MAX_BYTES = 32 * 1024 * 1024;
  private readonly done = new LRUCache<string, Buffer>({
    maxSize: PlanPdfCache.MAX_BYTES,
    sizeCalculation: (pdf) => Math.max(1, pdf.length),
  });
  private readonly rendering = new Map<string, Promise<Buffer>>();

  constructor(private readonly cpu: CpuPool) {}

  /** The PDF of `plan`, rendered once per version of it. */
  async pdf(plan: ReviewPlanJson): Promise<Buffer> {
    const key = contentDigest(plan);
    const kept = this.done.get(key);
    if (kept) return kept;
    let pending = this.rendering.get(key);
    if (!pending) {
      pending = this.cpu.planPdf(plan);
      this.rendering.set(key, pending);
      void pending
        .then(
          (pdf) => void this.done.set(key, pdf),
          () => undefined,
        )
        .finally(() => this.rendering.delete(key));
    }
    return pending;
  }
}
