import { fuzzWriteRoutes } from './support/fuzz.js';

// Every write route gets 1,000 hostile bodies; the routes are shared between two files so
// that two workers can run them side by side.
fuzzWriteRoutes({ part: 1, of: 2 });
