import { benchBrowser } from './browser.bench';

// Figures only; not part of `npm test`. Needs `npm run build` first (it serves the built app).
await benchBrowser();
