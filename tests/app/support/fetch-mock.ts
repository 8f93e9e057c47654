/**
 * A fetch stand-in for component tests: answers by "METHOD /path" with a status and JSON body,
 * records every call, and fails loudly on a request no test expected.
 */
export interface MockReply {
  status: number;
  body?: unknown;
}

type Handler = MockReply | ((init: { body?: unknown; query: URLSearchParams }) => MockReply);

export interface FetchCall {
  method: string;
  path: string;
  body?: unknown;
  headers: Record<string, string>;
}

export function installFetchMock(routes: Record<string, Handler>) {
  const calls: FetchCall[] = [];
  const mock = jest.fn(async (input: string, init: RequestInit = {}) => {
    const method = (init.method ?? 'GET').toUpperCase();
    const url = new URL(input, 'http://localhost');
    const path = url.pathname;
    const body = typeof init.body === 'string' ? JSON.parse(init.body) : undefined;
    calls.push({ method, path, body, headers: { ...((init.headers ?? {}) as Record<string, string>) } });
    const handler = routes[`${method} ${path}`];
    if (!handler) throw new Error(`Unexpected request in test: ${method} ${path}`);
    const reply = typeof handler === 'function' ? handler({ body, query: url.searchParams }) : handler;
    return {
      ok: reply.status >= 200 && reply.status < 300,
      status: reply.status,
      text: async () => (reply.body === undefined ? '' : JSON.stringify(reply.body)),
    } as Response;
  });
  globalThis.fetch = mock as unknown as typeof fetch;
  return { calls, mock };
}

export const apiError = (status: number, code: string, message: string, fields?: Record<string, string>): MockReply => ({
  status,
  body: { error: { code, message, ...(fields ? { fields } : {}) } },
});
