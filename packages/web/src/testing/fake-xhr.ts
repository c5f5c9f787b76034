import { vi } from 'vitest';

export type SentForm = {
  method: string;
  path: string;
  headers: Record<string, string>;
  fields: Record<string, string>;
  files: { field: string; name: string; size: number }[];
};

type Reply = { status: number; body?: unknown } | 'network-error';

/**
 * Replaces `XMLHttpRequest` (used for multipart uploads) with a fake that records each form sent,
 * reports upload progress in two steps, and answers with the replies given, in order.
 */
export function fakeUploads(...replies: Reply[]) {
  const sent: SentForm[] = [];
  let next = 0;

  class FakeXhr {
    status = 0;
    statusText = '';
    responseText = '';
    private method = 'GET';
    private url = '';
    private headers: Record<string, string> = {};
    private listeners: Record<string, (() => void)[]> = {};
    private progress: ((event: {
      lengthComputable: boolean;
      loaded: number;
      total: number;
    }) => void)[] = [];
    readonly upload = {
      addEventListener: (
        _type: 'progress',
        listener: (event: { lengthComputable: boolean; loaded: number; total: number }) => void,
      ) => this.progress.push(listener),
    };

    open(method: string, url: string) {
      this.method = method;
      this.url = url;
    }

    setRequestHeader(name: string, value: string) {
      this.headers[name.toLowerCase()] = value;
    }

    addEventListener(type: string, listener: () => void) {
      (this.listeners[type] ??= []).push(listener);
    }

    send(body: FormData) {
      const fields: Record<string, string> = {};
      const files: SentForm['files'] = [];
      for (const [field, value] of body.entries()) {
        if (typeof value === 'string') fields[field] = value;
        else files.push({ field, name: value.name, size: value.size });
      }
      sent.push({
        method: this.method,
        path: this.url.replace(/^\/api/, ''),
        headers: this.headers,
        fields,
        files,
      });
      const reply = replies[Math.min(next, replies.length - 1)] ?? 'network-error';
      next += 1;
      setTimeout(() => {
        const total = files.reduce((sum, f) => sum + f.size, 0) || 1;
        for (const loaded of [Math.floor(total / 2), total]) {
          this.progress.forEach((l) => l({ lengthComputable: true, loaded, total }));
        }
        if (reply === 'network-error') {
          this.listeners.error?.forEach((l) => l());
          return;
        }
        this.status = reply.status;
        this.responseText = reply.body === undefined ? '' : JSON.stringify(reply.body);
        this.listeners.load?.forEach((l) => l());
      }, 0);
    }
  }

  vi.stubGlobal('XMLHttpRequest', FakeXhr);
  return { sent };
}
