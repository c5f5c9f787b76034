import type session from 'express-session';

type Data = session.SessionData;
type Done = (err?: unknown) => void;

/** When the store will stop answering for this session: its cookie's end, as the store sets. */
function endOf(sess: Data, now: number): number {
  const expires = sess.cookie?.expires;
  return expires ? new Date(expires).getTime() : now + 24 * 60 * 60 * 1000;
}

/**
 * Keeps the sessions this process last read or wrote, so a signed-in request does not read
 * the sessions file each time. Only for a store no other process writes (SQLite: one process
 * per data folder). Every write goes to the store first and is kept only once it succeeded; a
 * session ends here when it ends in the store (its cookie's end, moved on by each touch that
 * reached the store). Kept as JSON, so no request can change another's copy.
 */
export class SessionReadCache {
  private readonly kept = new Map<string, { json: string; ends: number }>();

  constructor(
    private readonly store: session.Store,
    private readonly max = 5_000,
  ) {
    const get = store.get.bind(store);
    const set = store.set.bind(store);
    const destroy = store.destroy.bind(store);
    const touch = store.touch?.bind(store);
    const clear = store.clear?.bind(store);

    store.get = (sid, callback) => {
      const hit = this.kept.get(sid);
      if (hit && hit.ends >= Date.now()) {
        process.nextTick(callback, null, JSON.parse(hit.json) as Data);
        return;
      }
      this.kept.delete(sid);
      get(sid, (err, sess) => {
        if (!err && sess) this.keep(sid, sess);
        callback(err, sess);
      });
    };
    store.set = (sid, sess, callback?: Done) => {
      this.kept.delete(sid);
      set(sid, sess, (err?: unknown) => {
        if (!err) this.keep(sid, sess);
        callback?.(err);
      });
    };
    store.destroy = (sid, callback?: Done) => {
      this.kept.delete(sid);
      destroy(sid, callback);
    };
    if (touch) {
      store.touch = (sid, sess, callback?: () => void) => {
        touch(sid, sess, (err?: unknown) => {
          if (err) this.kept.delete(sid);
          else if (this.kept.has(sid)) this.keep(sid, sess);
          (callback as Done | undefined)?.(err);
        });
      };
    }
    if (clear) {
      store.clear = (callback?: Done) => {
        this.forgetAll();
        clear(callback);
      };
    }
  }

  /** For writes made past the store (ending a user's other sessions in SQL). */
  forgetAll(): void {
    this.kept.clear();
  }

  private keep(sid: string, sess: Data): void {
    this.kept.delete(sid);
    if (this.kept.size >= this.max) this.kept.delete(this.kept.keys().next().value!);
    this.kept.set(sid, { json: JSON.stringify(sess), ends: endOf(sess, Date.now()) });
  }
}
