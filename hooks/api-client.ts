/**
 * The one way the app talks to the API. Every call resolves to a typed result or a typed
 * problem (status, code, message, field messages); nothing else leaks out of here.
 */
import type { z } from 'zod';
import { WRONG_PASSWORD_CODE, type ApiErrorBody } from '../constants/schemas/errors';
import { markSessionExpired } from './connection-recovery';

/** '' means same origin (npm start); `npm run dev` sets it to the API's own port. */
const API_BASE = (process.env.EXPO_PUBLIC_API_URL ?? '').replace(/\/$/, '');

/** The full URL of an API path (for links and uploads that do not go through fetch). */
export const apiUrl = (path: string) => `${API_BASE}${path}`;

export interface ApiProblemInfo {
  /** HTTP status, or 0 when the server could not be reached. */
  status: number;
  code: string;
  message: string;
  fields?: Record<string, string>;
  /** The whole JSON answer, for problems that carry more than a message (a 409's current data). */
  body?: unknown;
}

/** Thrown by `apiOrThrow` so TanStack Query sees failures; carries the typed problem. */
export class ApiProblem extends Error implements ApiProblemInfo {
  readonly status: number;
  readonly code: string;
  readonly fields?: Record<string, string>;
  readonly body?: unknown;
  constructor(info: ApiProblemInfo) {
    super(info.message);
    this.name = 'ApiProblem';
    this.status = info.status;
    this.code = info.code;
    this.fields = info.fields;
    this.body = info.body;
  }
}

export type ApiResult<T> = { ok: true; status: number; data: T } | { ok: false; problem: ApiProblem };

type Method = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';

interface RequestOptions<S extends z.ZodType | undefined> {
  method?: Method;
  body?: unknown;
  /** Checks the response shape; a mismatch becomes a problem instead of a wrong screen. */
  schema?: S;
  signal?: AbortSignal;
  /** Extra request headers, e.g. If-Match on a step save. */
  headers?: Record<string, string>;
}

type Parsed<S> = S extends z.ZodType ? z.output<S> : unknown;

function isErrorBody(value: unknown): value is ApiErrorBody {
  const error = (value as ApiErrorBody | null)?.error;
  return typeof error === 'object' && error !== null && typeof error.message === 'string';
}

const FALLBACK_MESSAGES: Record<number, string> = {
  401: 'Sign in to continue.',
  403: 'Your role does not allow this.',
  404: 'Not found.',
};

export async function api<S extends z.ZodType | undefined = undefined>(path: string, options: RequestOptions<S> = {}): Promise<ApiResult<Parsed<S>>> {
  const { method = 'GET', body, schema, signal, headers = {} } = options;
  let response: Response;
  try {
    response = await fetch(`${API_BASE}${path}`, {
      method,
      credentials: 'include',
      headers: body === undefined ? { Accept: 'application/json', ...headers } : { Accept: 'application/json', 'Content-Type': 'application/json', ...headers },
      body: body === undefined ? undefined : JSON.stringify(body),
      signal,
    });
  } catch (err) {
    if ((err as Error)?.name === 'AbortError') throw err;
    return { ok: false, problem: new ApiProblem({ status: 0, code: 'network', message: 'Fieldfile’s server could not be reached. Check your connection and try again.' }) };
  }

  let json: unknown = undefined;
  if (response.status !== 204) {
    const text = await response.text();
    if (text) {
      try {
        json = JSON.parse(text);
      } catch {
        json = undefined;
      }
    }
  }

  if (!response.ok) {
    // A signed-in request refused for want of a session: the session ended mid-work. A wrong
    // password re-entered on a form (signing) is a field error, not the end of the session.
    const wrongPassword = isErrorBody(json) && json.error.code === WRONG_PASSWORD_CODE;
    if (response.status === 401 && !path.startsWith('/api/auth/') && !wrongPassword) markSessionExpired();
    if (isErrorBody(json)) {
      const { code, message, fields } = json.error;
      return { ok: false, problem: new ApiProblem({ status: response.status, code: code || 'error', message, fields, body: json }) };
    }
    const message = FALLBACK_MESSAGES[response.status] ?? `The server answered ${response.status}. Try again in a moment.`;
    return { ok: false, problem: new ApiProblem({ status: response.status, code: 'http_error', message }) };
  }

  if (!schema) return { ok: true, status: response.status, data: json as Parsed<S> };
  const parsed = schema.safeParse(json);
  if (!parsed.success) {
    return {
      ok: false,
      problem: new ApiProblem({ status: response.status, code: 'bad_response', message: 'The server sent an answer this version of the app does not understand. Reload the page.' }),
    };
  }
  return { ok: true, status: response.status, data: parsed.data as Parsed<S> };
}

/** For query and mutation functions: the data, or a thrown ApiProblem. */
export async function apiOrThrow<S extends z.ZodType | undefined = undefined>(path: string, options: RequestOptions<S> = {}): Promise<Parsed<S>> {
  const result = await api(path, options);
  if (!result.ok) throw result.problem;
  return result.data;
}

export function asProblem(error: unknown): ApiProblem {
  if (error instanceof ApiProblem) return error;
  return new ApiProblem({ status: 0, code: 'client', message: (error as Error)?.message || 'Something went wrong.' });
}
