// SQLite's queries, sharp, password hashing and file syncs all share libuv's thread pool, which
// is 4 threads unless set before it first starts: a photo being saved then held up every read.
// Set here, before anything is imported (imports run first even when written below).
process.env.UV_THREADPOOL_SIZE ??= '16';
await import('./server.js');
