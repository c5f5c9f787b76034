import { performance } from 'node:perf_hooks';
import sharp from 'sharp';
import { PhotoPipeline } from '../src/photos/photo-pipeline.service.js';
import { report } from './figures.js';
import { ms, summary, table } from './stats.js';

const RUNS = Number(process.env.BENCH_PHOTO_RUNS ?? 30);

/** A 12 MP (4000×3000) JPEG with photo-like texture: smoothed noise under pencil strokes. */
async function twelveMegapixelJpeg(): Promise<Buffer> {
  const texture = await sharp({
    create: {
      width: 1000,
      height: 750,
      channels: 3,
      background: '#ffffff',
      noise: { type: 'gaussian', mean: 200, sigma: 40 },
    },
  })
    .png()
    .toBuffer();
  const strokes = Buffer.from(
    `<svg xmlns="http://www.w3.org/2000/svg" width="4000" height="3000">${Array.from(
      { length: 40 },
      (_, i) =>
        `<path d="M${200 + i * 90} 400 q 60 ${300 + (i % 7) * 40} 10 ${900 + (i % 5) * 80}" stroke="#333" stroke-width="14" fill="none"/>`,
    ).join('')}</svg>`,
  );
  return sharp(texture)
    .resize(4000, 3000, { kernel: 'cubic' })
    .composite([{ input: strokes }])
    .jpeg({ quality: 90 })
    .withMetadata({ orientation: 6 })
    .toBuffer();
}

async function time(run: () => Promise<unknown>): Promise<number> {
  const start = performance.now();
  await run();
  return performance.now() - start;
}

export async function benchPhotoPipeline(): Promise<void> {
  const input = await twelveMegapixelJpeg();
  const pipeline = new PhotoPipeline();
  const bare = () => sharp(input).resize(2048, 2048, { fit: 'inside' }).jpeg().toBuffer();
  await pipeline.process(input);
  await bare();

  const rssBefore = process.memoryUsage().rss;
  let rssPeak = rssBefore;
  const sampler = setInterval(() => {
    rssPeak = Math.max(rssPeak, process.memoryUsage().rss);
  }, 2);
  const ours: number[] = [];
  const plain: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    ours.push(await time(() => pipeline.process(input)));
    plain.push(await time(bare));
  }
  clearInterval(sampler);

  const refusals: Record<string, number[]> = {
    'decompression bomb (400 MP PNG)': [],
    'truncated JPEG': [],
  };
  const bomb = await import('node:fs').then((fs) =>
    fs.readFileSync(new URL('../../../fixtures/photos/bomb-20000.png', import.meta.url)),
  );
  const truncated = input.subarray(0, Math.floor(input.length / 2));
  for (let i = 0; i < 10; i++) {
    refusals['decompression bomb (400 MP PNG)']!.push(
      await time(() => pipeline.process(bomb).catch(() => 0)),
    );
    refusals['truncated JPEG']!.push(await time(() => pipeline.process(truncated).catch(() => 0)));
  }

  const a = summary(ours);
  const b = summary(plain);
  table(
    `Photo pipeline on a 12 MP JPEG (${(input.length / 1024 / 1024).toFixed(1)} MiB, ${RUNS} runs)`,
    [
      { step: 'pipeline: orient + display 2048 + thumb 400', median: ms(a.median), p95: ms(a.p95) },
      { step: 'bare sharp resize to 2048', median: ms(b.median), p95: ms(b.p95) },
      {
        step: 'ratio pipeline / bare (median)',
        median: (a.median / b.median).toFixed(2),
        p95: (a.p95 / b.p95).toFixed(2),
      },
      ...Object.entries(refusals).map(([step, s]) => ({
        step: `refusal: ${step}`,
        median: ms(summary(s).median),
        p95: ms(summary(s).p95),
      })),
    ],
  );
  const growth = `${((rssPeak - rssBefore) / 1024 / 1024).toFixed(0)} MB`;
  console.log(`peak RSS growth during the runs: ${growth}`);
  report([
    {
      area: 'photos',
      measure: '12 MP pipeline median / p95',
      value: `${ms(a.median)} / ${ms(a.p95)}`,
    },
    {
      area: 'photos',
      measure: 'bare sharp resize median / p95',
      value: `${ms(b.median)} / ${ms(b.p95)}`,
    },
    {
      area: 'photos',
      measure: 'pipeline ÷ bare sharp (median)',
      value: (a.median / b.median).toFixed(2),
    },
    ...Object.entries(refusals).map(([step, s]) => ({
      area: 'photos',
      measure: `refusal: ${step} (median)`,
      value: ms(summary(s).median),
    })),
    { area: 'photos', measure: 'peak RSS growth', value: growth },
  ]);
}
