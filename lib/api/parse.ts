import { z } from 'zod';
import { badRequest, payloadTooLarge, ProblemError } from '@/lib/errors';

/** Reads a JSON body, refusing non-JSON, malformed or oversized bodies before anything else runs. */
export async function readJsonBody(request: Request, maxBytes: number): Promise<unknown> {
  const declared = Number(request.headers.get('content-length') ?? '0');
  if (declared > maxBytes) throw payloadTooLarge(maxBytes);
  const type = request.headers.get('content-type') ?? '';
  if (!type.toLowerCase().startsWith('application/json')) {
    throw badRequest('Send the body as JSON with the header Content-Type: application/json.');
  }
  const text = await request.text();
  if (new TextEncoder().encode(text).length > maxBytes) throw payloadTooLarge(maxBytes);
  if (!text.trim()) throw badRequest('The request body is empty; send a JSON object.');
  try {
    return JSON.parse(text);
  } catch (error) {
    throw badRequest(`The request body is not valid JSON (${(error as Error).message}).`);
  }
}

/** Turns a zod error into a 400 that names each field and what to fix. */
export function zodProblem(error: z.ZodError, where: 'body' | 'query' | 'path'): ProblemError {
  const errors = error.issues.map((issue) => {
    const field = issue.path.length ? issue.path.join('.') : where;
    if (issue.code === 'unrecognized_keys') {
      return { field, message: `Unknown field${issue.keys.length > 1 ? 's' : ''} ${issue.keys.map((k) => `'${k}'`).join(', ')}: remove ${issue.keys.length > 1 ? 'them' : 'it'}.` };
    }
    return { field, message: issue.message };
  });
  const detail = errors.map((e) => `${e.field}: ${e.message}`).join('; ');
  return badRequest(`Fix the ${where === 'body' ? 'request body' : where === 'query' ? 'query string' : 'address'}: ${detail}`, { errors });
}
