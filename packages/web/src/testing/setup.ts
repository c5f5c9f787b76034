import '@testing-library/jest-dom/vitest';

import { cleanup, configure } from '@testing-library/react';
import { afterEach } from 'vitest';

import { forgetCsrfToken } from '../lib/api-client';

// Route modules load lazily (the students page brings in the table); on a busy machine the first
// import takes longer than Testing Library's 1 s default.
configure({ asyncUtilTimeout: 5000 });

afterEach(() => {
  cleanup();
  forgetCsrfToken();
});
