import * as m0001 from './0001-foundation.js';
import * as m0002 from './0002-misses.js';
import * as m0003 from './0003-curriculum-keys-sittings.js';
import * as m0004 from './0004-members-mail.js';
import * as m0005 from './0005-patterns-review-plans.js';
import * as m0006 from './0006-miss-search.js';
import * as m0007 from './0007-miss-facts.js';
import * as m0008 from './0008-miss-idempotency-keys.js';
import * as m0009 from './0009-email-verification.js';
import * as m0010 from './0010-shared-state.js';
import * as m0011 from './0011-check-ups.js';
import * as m0012 from './0012-word-problem-lines.js';
import * as m0013 from './0013-miss-kind.js';
import * as m0014 from './0014-miss-search-by-household.js';
import * as m0015 from './0015-miss-search-merged.js';

/** Every migration in order; listed explicitly so src and dist behave alike. */
export const MIGRATIONS = [
  m0001,
  m0002,
  m0003,
  m0004,
  m0005,
  m0006,
  m0007,
  m0008,
  m0009,
  m0010,
  m0011,
  m0012,
  m0013,
  m0014,
  m0015,
];
