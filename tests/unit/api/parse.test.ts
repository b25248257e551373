import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { readJsonBody, zodProblem } from '@/lib/api/parse';
import { ProblemError } from '@/lib/errors';

const request = (body: string, type = 'application/json') =>
  new Request('http://localhost/x', { method: 'POST', body, headers: { 'content-type': type, 'content-length': String(Buffer.byteLength(body)) } });

describe('readJsonBody', () => {
  it('should parse a JSON object', async () => {
    expect(await readJsonBody(request('{"a":1}'), 1024)).toEqual({ a: 1 });
  });

  it('should refuse oversize, malformed, empty and non-JSON bodies with the right status', async () => {
    const statusOf = async (r: Request, limit = 1024) => readJsonBody(r, limit).then(() => 200, (e: ProblemError) => e.status);
    expect(await statusOf(request('{"a":"' + 'x'.repeat(2000) + '"}'))).toBe(413);
    expect(await statusOf(request('{"a":'))).toBe(400);
    expect(await statusOf(request(' '))).toBe(400);
    expect(await statusOf(request('a=1', 'application/x-www-form-urlencoded'))).toBe(400);
  });
});

describe('zodProblem', () => {
  it('should name each field and say what to remove for unknown fields', () => {
    const schema = z.strictObject({ email: z.string().email('email must be an e-mail address') });
    const result = schema.safeParse({ email: 'nope', extra: true });
    const problem = zodProblem(result.error!, 'body');
    expect(problem.status).toBe(400);
    expect(problem.extra.errors).toEqual(
      expect.arrayContaining([
        { field: 'email', message: 'email must be an e-mail address' },
        { field: 'body', message: "Unknown field 'extra': remove it." },
      ]),
    );
    expect(problem.detail).toContain('email: email must be an e-mail address');
  });
});
