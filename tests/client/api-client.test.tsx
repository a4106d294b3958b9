import { afterEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { ApiError, apiRequest, errorFromResponse } from '../../src/lib/api-client';

const json = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

afterEach(() => vi.unstubAllGlobals());

describe('api-client', () => {
  it('when the server answers 400 with field errors, then the ApiError carries status, code, message and fields', async () => {
    const error = await errorFromResponse(
      json(400, {
        error: {
          code: 'validation_failed',
          message: 'Some fields are not valid.',
          fields: [{ path: 'email', message: 'is not an e-mail address' }],
        },
      }),
    );
    expect(error).toBeInstanceOf(ApiError);
    expect(error.status).toBe(400);
    expect(error.code).toBe('validation_failed');
    expect(error.message).toBe('Some fields are not valid.');
    expect(error.fields).toEqual([{ path: 'email', message: 'is not an e-mail address' }]);
    expect(error.fieldMessage('email')).toBe('is not an e-mail address');
  });

  it('when the error body is not JSON (a proxy page), then the ApiError has a generic code and a readable message', async () => {
    const error = await errorFromResponse(new Response('<html>Bad gateway</html>', { status: 502 }));
    expect(error.status).toBe(502);
    expect(error.code).toBe('http_502');
    expect(error.message).toMatch(/server had a problem/);
    expect(error.fields).toEqual([]);
  });

  it('when a call fails, then apiRequest throws the parsed ApiError and sent JSON with the same-origin cookie', async () => {
    const fetchMock = vi.fn(async () => json(403, { error: { code: 'forbidden', message: 'Your role may not do this.' } }));
    vi.stubGlobal('fetch', fetchMock);
    const failure = apiRequest('/api/users', { method: 'POST', body: { email: 'a@b.example' } });
    await expect(failure).rejects.toMatchObject({ status: 403, code: 'forbidden', fields: [] });
    const [path, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(path).toBe('/api/users');
    expect(init.credentials).toBe('same-origin');
    expect(init.body).toBe('{"email":"a@b.example"}');
    expect((init.headers as Record<string, string>)['Content-Type']).toBe('application/json');
  });

  it('when the server cannot be reached, then the ApiError has status 0 and code network_error', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))));
    await expect(apiRequest('/api/me')).rejects.toMatchObject({ status: 0, code: 'network_error' });
  });

  it('when the answer does not match the shared schema, then apiRequest throws invalid_response', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => json(200, { id: 42 })));
    const consoleError = vi.spyOn(console, 'error').mockImplementation(() => {});
    await expect(apiRequest('/api/me', { schema: z.object({ id: z.string() }) })).rejects.toMatchObject({
      code: 'invalid_response',
    });
    expect(consoleError).toHaveBeenCalled();
    consoleError.mockRestore();
  });

  it('when the answer matches the schema, then apiRequest returns the parsed value', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => json(200, { id: 'x', extra: true })));
    await expect(apiRequest('/api/me', { schema: z.object({ id: z.string() }) })).resolves.toEqual({ id: 'x' });
  });
});
