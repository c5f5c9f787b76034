declare module 'connect-sqlite3' {
  import type session from 'express-session';
  import type { Database } from 'sqlite3';

  interface SQLiteStoreOptions {
    db?: Database | string;
    dir?: string;
    table?: string;
    concurrentDb?: boolean;
  }
  type SQLiteStoreClass = new (options?: SQLiteStoreOptions) => session.Store;
  export default function connectSqlite3(s: typeof session): SQLiteStoreClass;
}
