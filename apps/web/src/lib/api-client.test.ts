import { afterEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { mockFetch } from '../test/fetch-mock';
import {
  ApiError,
  apiRequest,
  sendWithConfirmation,
  setUnauthenticatedHandler,
} from './api-client';

afterEach(() => {
  setUnauthenticatedHandler(() => {});
  vi.unstubAllEnvs();
});

describe('apiRequest', () => {
  it('when the server answers the uniform error body, then the ApiError carries code, message and fields', async () => {
    mockFetch({
      'POST /api/chemicals': {
        status: 400,
        body: {
          error: {
            code: 'validation_failed',
            message: 'Some fields need a look',
            fields: {
              casNumber: 'check digit should be 7',
              'ghsPictograms.1': 'must be a GHS pictogram code',
            },
          },
        },
      },
    });

    const error = await apiRequest('/api/chemicals', { method: 'POST', body: {} }).catch(
      (e: unknown) => e,
    );

    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({
      status: 400,
      code: 'validation_failed',
      message: 'Some fields need a look',
      fields: {
        casNumber: 'check digit should be 7',
        'ghsPictograms.1': 'must be a GHS pictogram code',
      },
    });
  });

  it('when an error body is not ours (a proxy page), then a readable internal error is thrown', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => new Response('<html>Bad gateway</html>', { status: 502 })),
    );

    const error = await apiRequest('/api/health').catch((e: unknown) => e);

    expect(error).toMatchObject({ status: 502, code: 'internal', fields: {} });
    expect((error as ApiError).message).toMatch(/server had a problem/i);
  });

  it('when the network fails, then a network_error is thrown', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))),
    );

    await expect(apiRequest('/api/health')).rejects.toMatchObject({
      code: 'network_error',
      status: 0,
    });
  });

  it('when a request answers 401, then the app is told to send the person to sign-in', async () => {
    mockFetch({
      'GET /api/chemicals': {
        status: 401,
        body: { error: { code: 'unauthenticated', message: 'Sign in first' } },
      },
    });
    const onUnauthenticated = vi.fn();
    setUnauthenticatedHandler(onUnauthenticated);

    await expect(apiRequest('/api/chemicals')).rejects.toMatchObject({ code: 'unauthenticated' });
    expect(onUnauthenticated).toHaveBeenCalledTimes(1);

    await expect(
      apiRequest('/api/chemicals', { allowUnauthenticated: true }),
    ).rejects.toBeInstanceOf(ApiError);
    expect(onUnauthenticated).toHaveBeenCalledTimes(1);
  });

  it('when the answer does not fit the contract, then a bad_response error is thrown', async () => {
    mockFetch({ 'GET /api/auth/me': { body: { person: 'someone' } } });

    await expect(
      apiRequest('/api/auth/me', { schema: z.object({ user: z.object({ id: z.number() }) }) }),
    ).rejects.toMatchObject({ code: 'bad_response' });
  });

  it('when built for production, then an answer is returned as it came, without the contract check', async () => {
    vi.stubEnv('DEV', false);
    mockFetch({ 'GET /api/auth/me': { body: { person: 'someone' } } });

    await expect(
      apiRequest('/api/auth/me', { schema: z.object({ user: z.object({ id: z.number() }) }) }),
    ).resolves.toEqual({ person: 'someone' });
  });

  it('when an error body names a code outside the closed list, then it is not taken as ours', async () => {
    mockFetch({
      'GET /api/chemicals': {
        status: 400,
        body: { error: { code: 'made_up', message: 'Something', fields: { name: 'x' } } },
      },
    });

    const error = await apiRequest('/api/chemicals').catch((e: unknown) => e);

    expect(error).toMatchObject({ status: 400, code: 'bad_response', fields: {} });
  });

  it('when an error body carries fields and warnings of other shapes, then only the well-formed ones are kept', async () => {
    mockFetch({
      'POST /api/containers/1/draws': {
        status: 409,
        body: {
          error: {
            code: 'confirmation_required',
            message: 'Confirm.',
            fields: { amount: 'must be positive', broken: 3 },
            warnings: [{ kind: 'hold', message: 'Held.' }, 'not a warning', { kind: 7 }],
          },
        },
      },
    });

    const error = await apiRequest('/api/containers/1/draws', { method: 'POST', body: {} }).catch(
      (e: unknown) => e,
    );

    expect(error).toMatchObject({
      code: 'confirmation_required',
      fields: { amount: 'must be positive' },
      warnings: [{ kind: 'hold', message: 'Held.' }],
    });
  });

  it('sends JSON with same-origin credentials', async () => {
    const { fetchMock, requests } = mockFetch({ 'PATCH /api/users/3': { body: { ok: true } } });

    await apiRequest('/api/users/3', { method: 'PATCH', body: { role: 'viewer' } });

    const init = fetchMock.mock.calls[0]?.[1];
    expect(init).toMatchObject({ credentials: 'same-origin', method: 'PATCH' });
    expect(init?.headers).toMatchObject({ 'Content-Type': 'application/json' });
    expect(requests[0]?.body).toEqual({ role: 'viewer' });
  });
});

describe('sendWithConfirmation', () => {
  const warning = {
    kind: 'hold',
    message: 'Held for plan #3.',
    planId: 3,
    planTitle: 'Aspirin',
    plannedOn: '2026-12-10',
    until: '2026-12-10',
    containerId: 42,
    labelCode: 'LW-00042',
    heldBefore: 65,
    heldAfter: 15,
    loses: 50,
    unit: 'mL',
  };

  function confirmingServer() {
    return mockFetch({
      'POST /api/containers/42/draws': (request) =>
        (request.body as { confirm?: boolean }).confirm
          ? { status: 201, body: { ok: true } }
          : {
              status: 409,
              body: {
                error: { code: 'confirmation_required', message: 'Confirm.', warnings: [warning] },
              },
            },
    });
  }
  const send = (confirm: boolean) =>
    apiRequest('/api/containers/42/draws', {
      method: 'POST',
      body: confirm ? { amount: 55, confirm } : { amount: 55 },
    });

  it('when the server asks for confirmation and the person goes ahead, then the same request is sent again with confirm', async () => {
    const { requests } = confirmingServer();
    const asked: unknown[] = [];
    const result = await sendWithConfirmation(send, async (warnings) => {
      asked.push(...warnings);
      return true;
    });
    expect(result).toEqual({ ok: true });
    expect(asked).toEqual([warning]);
    expect(requests.map((r) => r.body)).toEqual([{ amount: 55 }, { amount: 55, confirm: true }]);
  });

  it('when the person declines, then nothing more is sent and the result is null', async () => {
    const { requests } = confirmingServer();
    expect(await sendWithConfirmation(send, async () => false)).toBeNull();
    expect(requests).toHaveLength(1);
  });
});
