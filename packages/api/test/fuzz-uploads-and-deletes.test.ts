import { describeFuzz, FUZZ_GROUPS } from './support/fuzz-routes.js';

// Split in three so the 1,000-body runs share the workers; together they cover every write route.
describeFuzz('fuzzing write routes (uploadsAndDeletes)', FUZZ_GROUPS.uploadsAndDeletes, 3);
