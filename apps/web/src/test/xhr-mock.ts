import { vi } from 'vitest';

/**
 * Stands in for the browser's XMLHttpRequest (used for uploads, for their progress events)
 * by handing each request to `fetch` — so the routes of {@link mockFetch} answer uploads too.
 * Upload progress is reported at half and at all of the body.
 */
export function mockXhrThroughFetch() {
  class FakeXhr {
    upload: { onprogress: ((event: ProgressEvent) => void) | null } = { onprogress: null };
    onload: (() => void) | null = null;
    onerror: (() => void) | null = null;
    onabort: (() => void) | null = null;
    status = 0;
    statusText = '';
    responseText = '';
    withCredentials = false;
    private method = 'GET';
    private url = '';

    open(method: string, url: string) {
      this.method = method;
      this.url = url;
    }
    setRequestHeader() {}
    abort() {
      this.onabort?.();
    }
    send(body: FormData) {
      const file = body.get('file');
      const size = file instanceof File ? file.size : 0;
      const progress = (loaded: number) =>
        this.upload.onprogress?.({ loaded, total: size, lengthComputable: true } as ProgressEvent);
      void (async () => {
        progress(Math.floor(size / 2));
        progress(size);
        try {
          const response = await fetch(this.url, { method: this.method, body });
          this.status = response.status;
          this.statusText = response.statusText;
          this.responseText = await response.text();
          this.onload?.();
        } catch (_error) {
          this.onerror?.();
        }
      })();
    }
  }
  vi.stubGlobal('XMLHttpRequest', FakeXhr);
}
