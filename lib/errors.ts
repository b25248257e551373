/**
 * The one error type route handlers and services throw for expected failures.
 * It becomes an RFC 9457 problem+json response; anything else becomes a
 * generic 500 without internals (database messages never leak).
 */
export class ProblemError extends Error {
  constructor(
    readonly status: number,
    readonly title: string,
    readonly detail: string,
    readonly extra: Record<string, unknown> = {},
  ) {
    super(detail);
    this.name = 'ProblemError';
  }
}

export const badRequest = (detail: string, extra?: Record<string, unknown>) => new ProblemError(400, 'Bad request', detail, extra);
export const unauthenticated = () => new ProblemError(401, 'Sign-in required', 'Sign in to continue.');
export const forbidden = (detail: string) => new ProblemError(403, 'Not allowed', detail);
export const notFound = (what: string) => new ProblemError(404, 'Not found', `${what} was not found.`);
export const conflict = (detail: string) => new ProblemError(409, 'Conflict', detail);
export const payloadTooLarge = (limitBytes: number) =>
  new ProblemError(413, 'Request too large', `The request body is larger than ${Math.round(limitBytes / 1024)} KiB; send less data.`);
export const gone = (detail: string) => new ProblemError(410, 'Gone', detail);
export const tooManyRequests = (detail: string) => new ProblemError(429, 'Too many attempts', detail);

export type ProblemBody = { type: string; title: string; status: number; detail: string; [key: string]: unknown };

/** Renders an error as application/problem+json (RFC 9457). */
export function problemResponse(error: unknown): Response {
  const problem: ProblemBody =
    error instanceof ProblemError
      ? { type: 'about:blank', title: error.title, status: error.status, detail: error.detail, ...error.extra }
      : { type: 'about:blank', title: 'Server error', status: 500, detail: 'Something went wrong on our side; nothing was changed. Try again, and tell an admin if it keeps happening.' };
  if (!(error instanceof ProblemError)) console.error(error);
  return new Response(JSON.stringify(problem), {
    status: problem.status,
    headers: { 'content-type': 'application/problem+json' },
  });
}
