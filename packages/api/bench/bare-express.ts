import express from 'express';

// The ceiling of this machine for the same answer: Express with nothing but the health route.
// Started as its own process by the per-request bench, as the real server is.
const app = express();
app.disable('x-powered-by');
app.get('/api/health', (_req, res) => {
  res.json({ status: 'ok', demo: true, version: '0.1.0' });
});
const server = app.listen(0, '127.0.0.1', () => {
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : 0;
  console.log(`running at http://127.0.0.1:${port}`);
});
process.on('SIGTERM', () => server.close(() => process.exit(0)));
