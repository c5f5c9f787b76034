import { LocalPhotoStorage } from '../src/storage/local-photo-storage.js';
import { randomUUID } from 'node:crypto';
const s = new LocalPhotoStorage('/tmp/wb-fam-run/photos-probe');
const data = Buffer.alloc(20000, 7);
for (let i = 0; i < 20; i++) await s.put(randomUUID() + '.jpg', data);
const c0 = process.cpuUsage();
const t0 = performance.now();
const N = 300;
for (let i = 0; i < N; i++)
  await Promise.all([
    s.put(randomUUID() + '.jpg', data),
    s.put(randomUUID() + '.jpg', data),
    s.put(randomUUID() + '.jpg', data),
  ]);
const c = process.cpuUsage(c0);
console.log(
  '3 puts: user',
  (c.user / 1000 / N).toFixed(2),
  'sys',
  (c.system / 1000 / N).toFixed(2),
  'wall',
  ((performance.now() - t0) / N).toFixed(2),
);
