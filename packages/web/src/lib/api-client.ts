/** Field name → message, as the API names bad input. */
export type FieldErrors = Record<string, string>;

const TOO_MANY_TRIES = 'Too many tries — wait a minute and try again.';
const OFFLINE = 'Workback could not be reached. Check your connection and try again.';

/** Every failed request becomes one of these, so screens can rely on `status` and `fields`. */
export class ApiError extends Error {
  readonly status: number;
  readonly fields: FieldErrors;

  constructor(status: number, message: string, fields: FieldErrors = {}) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.fields = fields;
  }
}

export function isApiError(error: unknown, status?: number): error is ApiError {
  return error instanceof ApiError && (status === undefined || error.status === status);
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

let csrfToken: string | null = null;
let csrfRequest: Promise<string> | null = null;

/**
 * The CSRF token is bound to the session and the session id changes on sign-in, sign-up and
 * sign-out: forget it then, and the next write fetches a fresh one.
 */
export function forgetCsrfToken(): void {
  csrfToken = null;
  csrfRequest = null;
}

async function getCsrfToken(): Promise<string> {
  if (csrfToken) return csrfToken;
  csrfRequest ??= send<{ token: string }>('GET', '/auth/csrf').then(
    ({ token }) => {
      csrfToken = token;
      return token;
    },
    (error: unknown) => {
      csrfRequest = null;
      throw error;
    },
  );
  return csrfRequest;
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

async function toApiError(response: Response): Promise<ApiError> {
  const body: unknown = await response.json().catch(() => null);
  const fields: FieldErrors = {};
  let message = response.statusText || `Request failed (${response.status})`;
  if (isRecord(body)) {
    if (typeof body.message === 'string') message = body.message;
    else if (Array.isArray(body.message)) message = body.message.map(String).join(' ');
    if (isRecord(body.fields)) {
      for (const [field, text] of Object.entries(body.fields)) {
        fields[field] = Array.isArray(text) ? text.map(String).join(' ') : String(text);
      }
    }
  }
  // A limit that says what it is (invitations an hour, mails an address) keeps its sentence;
  // a bare throttler name gets the general one.
  if (response.status === 429 && !/\s/.test(message)) message = TOO_MANY_TRIES;
  return new ApiError(response.status, message, fields);
}

async function send<T>(method: Method, path: string, body?: unknown, csrf?: string): Promise<T> {
  const headers: Record<string, string> = { accept: 'application/json' };
  if (body !== undefined) headers['content-type'] = 'application/json';
  if (csrf) headers['x-csrf-token'] = csrf;
  let response: Response;
  try {
    response = await fetch(`/api${path}`, {
      method,
      headers,
      credentials: 'same-origin',
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  } catch {
    throw new ApiError(0, OFFLINE);
  }
  if (!response.ok) {
    const error = await toApiError(response);
    if (error.status === 401) forgetCsrfToken();
    throw error;
  }
  if (response.status === 204) return undefined as T;
  const text = await response.text();
  return (text ? JSON.parse(text) : undefined) as T;
}

async function write<T>(method: Exclude<Method, 'GET'>, path: string, body?: unknown): Promise<T> {
  try {
    return await send<T>(method, path, body, await getCsrfToken());
  } catch (error) {
    // A stale token (the session changed underneath us): fetch a new one and retry once.
    if (isApiError(error, 403) && /csrf/i.test(error.message)) {
      forgetCsrfToken();
      return send<T>(method, path, body, await getCsrfToken());
    }
    throw error;
  }
}

/** Bytes sent so far of a multipart upload. */
export type UploadProgress = { loaded: number; total: number };

export type UploadOptions = {
  onProgress?: (progress: UploadProgress) => void;
  /** Extra request headers, e.g. an `Idempotency-Key` that makes a retry safe. */
  headers?: Record<string, string>;
};

/** fetch reports no upload progress, so multipart writes go through XMLHttpRequest. */
function sendForm<T>(
  path: string,
  form: FormData,
  csrf: string,
  { onProgress, headers = {} }: UploadOptions,
): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api${path}`);
    for (const [name, value] of Object.entries(headers)) xhr.setRequestHeader(name, value);
    xhr.setRequestHeader('accept', 'application/json');
    xhr.setRequestHeader('x-csrf-token', csrf);
    if (onProgress) {
      xhr.upload.addEventListener('progress', (event) => {
        if (event.lengthComputable) onProgress({ loaded: event.loaded, total: event.total });
      });
    }
    xhr.addEventListener('error', () => reject(new ApiError(0, OFFLINE)));
    xhr.addEventListener('abort', () => reject(new ApiError(0, OFFLINE)));
    xhr.addEventListener('load', () => {
      const status = xhr.status;
      if (status === 0) {
        reject(new ApiError(0, OFFLINE));
        return;
      }
      const response = new Response(status === 204 ? null : xhr.responseText, {
        status,
        statusText: xhr.statusText,
      });
      if (status < 200 || status >= 300) {
        void toApiError(response).then((error) => {
          if (error.status === 401) forgetCsrfToken();
          reject(error);
        });
        return;
      }
      resolve((xhr.responseText ? JSON.parse(xhr.responseText) : undefined) as T);
    });
    xhr.send(form);
  });
}

async function upload<T>(path: string, form: FormData, options: UploadOptions = {}): Promise<T> {
  try {
    return await sendForm<T>(path, form, await getCsrfToken(), options);
  } catch (error) {
    if (isApiError(error, 403) && /csrf/i.test(error.message)) {
      forgetCsrfToken();
      return sendForm<T>(path, form, await getCsrfToken(), options);
    }
    throw error;
  }
}

/** A file the API sends as an attachment (an export zip, a PDF, a CSV). */
export type DownloadedFile = { blob: Blob; filename: string };

/** `attachment; filename="plan-3.pdf"` → `'plan-3.pdf'`. */
export function filenameOf(disposition: string | null, fallback: string): string {
  const match = /filename\*?=(?:UTF-8'')?"?([^";]+)"?/i.exec(disposition ?? '');
  if (!match?.[1]) return fallback;
  try {
    return decodeURIComponent(match[1]);
  } catch {
    return match[1];
  }
}

/** GETs a file as bytes, so a failure shows as a message on the page instead of a JSON tab. */
async function download(path: string, fallbackName: string): Promise<DownloadedFile> {
  let response: Response;
  try {
    response = await fetch(`/api${path}`, { credentials: 'same-origin' });
  } catch {
    throw new ApiError(0, OFFLINE);
  }
  if (!response.ok) {
    const error = await toApiError(response);
    if (error.status === 401) forgetCsrfToken();
    throw error;
  }
  const blob = await response.blob();
  return { blob, filename: filenameOf(response.headers.get('content-disposition'), fallbackName) };
}

/** The one client for Workback's JSON API (same origin, under /api). */
export const api = {
  get: <T>(path: string) => send<T>('GET', path),
  post: <T>(path: string, body?: unknown) => write<T>('POST', path, body),
  put: <T>(path: string, body?: unknown) => write<T>('PUT', path, body),
  patch: <T>(path: string, body?: unknown) => write<T>('PATCH', path, body),
  /** A body is rare on DELETE; deleting the household sends its typed confirmation. */
  delete: <T = void>(path: string, body?: unknown) => write<T>('DELETE', path, body),
  /** A multipart POST (photos), reporting upload progress. */
  upload,
  download,
};
