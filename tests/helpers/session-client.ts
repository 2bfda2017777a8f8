import { CookieJar } from 'tough-cookie';
import { DEMO_PASSWORD } from '../../ops/idp/demo-accounts.js';

export interface ApiResponse<T = unknown> {
  status: number;
  body: T;
  headers: Headers;
}

/**
 * A browserless user agent: a cookie jar plus manual redirects, so that a test walks the real
 * OpenID Connect flow (our /auth/login → provider login form → consent → our callback).
 */
export class SessionClient {
  readonly jar = new CookieJar();
  private csrfToken: string | undefined;

  constructor(readonly baseUrl: string) {}

  async raw(url: string, init: RequestInit = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    const cookie = await this.jar.getCookieString(url);
    if (cookie) headers.set('cookie', cookie);
    const response = await fetch(url, { ...init, headers, redirect: 'manual' });
    for (const setCookie of response.headers.getSetCookie()) await this.jar.setCookie(setCookie, url);
    return response;
  }

  /** Signs in through the identity provider's own pages; returns the final landing URL. */
  async signIn(
    email: string,
    password = DEMO_PASSWORD,
  ): Promise<{ landedAt: string; finalStatus: number; page?: string }> {
    let url = `${this.baseUrl}/auth/login`;
    let init: RequestInit = {};
    let credentialsSent = false;
    for (let hop = 0; hop < 20; hop++) {
      const response = await this.raw(url, init);
      init = {};
      const location = response.headers.get('location');
      if (response.status >= 300 && response.status < 400 && location) {
        url = new URL(location, url).toString();
        if (url.startsWith(this.baseUrl) && !new URL(url).pathname.startsWith('/auth/'))
          return { landedAt: url, finalStatus: response.status };
        continue;
      }
      const html = await response.text();
      const login = /action="([^"]*\/login)"/.exec(html);
      const confirm = /action="([^"]*\/confirm)"/.exec(html);
      if (login && !credentialsSent) {
        credentialsSent = true;
        url = new URL(login[1], url).toString();
        init = {
          method: 'POST',
          headers: { 'content-type': 'application/x-www-form-urlencoded' },
          body: new URLSearchParams({ email, password }).toString(),
        };
      } else if (confirm) {
        url = new URL(confirm[1], url).toString();
        init = { method: 'POST' };
      } else {
        return { landedAt: url, finalStatus: response.status, page: html };
      }
    }
    throw new Error('sign-in did not finish within 20 redirects');
  }

  async csrf(): Promise<string> {
    this.csrfToken ??= (await this.request<{ token: string }>('GET', '/api/v1/csrf-token')).body.token;
    return this.csrfToken;
  }

  /** POSTs multipart/form-data (with the CSRF token), as a browser form sends a file upload. */
  async postForm<T = unknown>(path: string, form: FormData): Promise<ApiResponse<T>> {
    const response = await this.raw(`${this.baseUrl}${path}`, {
      method: 'POST',
      body: form,
      headers: { 'x-csrf-token': await this.csrf(), accept: 'application/json' },
    });
    const text = await response.text();
    return { status: response.status, headers: response.headers, body: (text ? JSON.parse(text) : undefined) as T };
  }

  async request<T = unknown>(
    method: string,
    path: string,
    body?: unknown,
    options: { csrf?: boolean } = {},
  ): Promise<ApiResponse<T>> {
    const headers: Record<string, string> = { accept: 'application/json' };
    if (body !== undefined) headers['content-type'] = 'application/json';
    if (options.csrf) headers['x-csrf-token'] = await this.csrf();
    const response = await this.raw(`${this.baseUrl}${path}`, {
      method,
      headers,
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    const text = await response.text();
    return {
      status: response.status,
      headers: response.headers,
      body: (text && response.headers.get('content-type')?.includes('json') ? JSON.parse(text) : text) as T,
    };
  }
}

/** Plain requests with an access token, as a script or plant bridge would make them. */
export async function tokenRequest<T = unknown>(
  baseUrl: string,
  token: string,
  method: string,
  path: string,
  body?: unknown,
): Promise<ApiResponse<T>> {
  const response = await fetch(`${baseUrl}${path}`, {
    method,
    headers: {
      authorization: `Bearer ${token}`,
      ...(body === undefined ? {} : { 'content-type': 'application/json' }),
    },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const text = await response.text();
  return { status: response.status, headers: response.headers, body: (text ? JSON.parse(text) : undefined) as T };
}
