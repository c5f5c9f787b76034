import * as m0001 from './0001-foundation.js';

/** Every migration in order; listed explicitly so src and dist behave alike. */
export const MIGRATIONS = [m0001];
