// A small signed-in HTTP client for the fault tests and the bench: fetch with the
// session cookie and the CSRF token (JSON bodies, or one file as multipart), a
// per-request timeout, and the time each call took.
export interface CallResult {
  status: number; // 0: no answer (timeout or connection refused)
  body: unknown;
  ms: number;
  error?: string;
}

export class ApiClient {
  private cookie = '';
  csrfToken = '';

  constructor(public baseUrl: string) {}

  /** The same session against another server (sessions live in the database). */
  withBaseUrl(baseUrl: string): ApiClient {
    const copy = new ApiClient(baseUrl);
    copy.cookie = this.cookie;
    copy.csrfToken = this.csrfToken;
    return copy;
  }

  get cookieHeader(): string {
    return this.cookie;
  }

  async signIn(email: string, password: string): Promise<void> {
    const result = await this.call('POST', '/api/session', { email, password });
    if (result.status !== 200) throw new Error(`sign-in failed: ${result.status} ${JSON.stringify(result.body)}`);
    this.csrfToken = (result.body as { csrfToken: string }).csrfToken;
  }

  call(method: string, path: string, body?: unknown, timeoutMs = 15_000): Promise<CallResult> {
    return this.send(method, path, body === undefined ? undefined : JSON.stringify(body), body !== undefined ? { 'content-type': 'application/json' } : {}, timeoutMs);
  }

  /** A multipart POST of one file (fetch sets the multipart content type and boundary). */
  upload(path: string, field: string, bytes: Buffer, fileName: string, mediaType: string, timeoutMs = 15_000): Promise<CallResult> {
    const form = new FormData();
    form.append(field, new Blob([new Uint8Array(bytes)], { type: mediaType }), fileName);
    return this.send('POST', path, form, {}, timeoutMs);
  }

  private async send(method: string, path: string, body: string | FormData | undefined, headers: Record<string, string>, timeoutMs: number): Promise<CallResult> {
    const started = performance.now();
    try {
      const response = await fetch(`${this.baseUrl}${path}`, {
        method,
        headers: {
          ...headers,
          ...(this.cookie ? { cookie: this.cookie } : {}),
          ...(this.csrfToken && method !== 'GET' ? { 'x-csrf-token': this.csrfToken } : {}),
        },
        body,
        signal: AbortSignal.timeout(timeoutMs),
      });
      const setCookie = response.headers.getSetCookie().find((value) => value.startsWith('whorl.sid='));
      if (setCookie) this.cookie = setCookie.split(';', 1)[0];
      const text = await response.text();
      let parsed: unknown = text;
      try {
        parsed = text ? JSON.parse(text) : null;
      } catch {
        /* not JSON: keep the text */
      }
      return { status: response.status, body: parsed, ms: performance.now() - started };
    } catch (error) {
      return { status: 0, body: null, ms: performance.now() - started, error: (error as Error).name + ': ' + (error as Error).message };
    }
  }
}
