// SQLite's queries, sharp, password hashing and file syncs all share libuv's thread pool, which
// is 4 threads unless UV_THREADPOOL_SIZE is set before it first starts. An ES module entry is
// too late for that: loading it already reads files on the pool. This entry is CommonJS, read
// synchronously, so the size set here holds; then it loads the ES server. (Under a TypeScript
// loader hook the pool has started before any entry runs: launchers set the variable instead.)
process.env.UV_THREADPOOL_SIZE ??= '16';
void import('./server.js');
