import 'server-only';
import { z } from 'zod';
import { actorFromRequest, authorize, type Actor, type StudioAccess } from '@/lib/auth/actor';
import type { Action } from '@/lib/auth/policy';
import { badRequest, payloadTooLarge, problemResponse, unauthenticated } from '@/lib/errors';
import { readJsonBody, zodProblem } from './parse';

// Next passes no params for routes without dynamic segments.
type RouteContext = { params?: Promise<Record<string, string | string[]>> };

type Config<P extends z.ZodType, B extends z.ZodType | undefined, Q extends z.ZodType | undefined> = {
  params: P;
  body?: B;
  query?: Q;
  /** 'public' routes skip the session check (e.g. accepting an invitation). */
  access: { studioAction: Action } | 'signed-in' | 'public';
  maxBodyBytes?: number;
  handler: (ctx: {
    request: Request;
    params: z.infer<P>;
    body: B extends z.ZodType ? z.infer<B> : undefined;
    query: Q extends z.ZodType ? z.infer<Q> : undefined;
    actor: Actor | null;
    access: StudioAccess | null;
  }) => Promise<Response>;
};

const DEFAULT_MAX_BODY_BYTES = 64 * 1024;

/**
 * Wraps a route handler in the fixed order: parse with the schemas (400/413),
 * session (401), authorize in the studio (404/403), then the handler. Every
 * failure is RFC 9457 problem+json; nothing is written before all checks pass.
 */
export function apiRoute<P extends z.ZodType, B extends z.ZodType | undefined = undefined, Q extends z.ZodType | undefined = undefined>(
  config: Config<P, B, Q>,
) {
  return async (request: Request, context: RouteContext): Promise<Response> => {
    try {
      const params = config.params.safeParse((await context?.params) ?? {});
      if (!params.success) throw zodProblem(params.error, 'path');

      let query: unknown;
      if (config.query) {
        const parsed = config.query.safeParse(Object.fromEntries(new URL(request.url).searchParams));
        if (!parsed.success) throw zodProblem(parsed.error, 'query');
        query = parsed.data;
      }

      let body: unknown;
      if (config.body) {
        const raw = await readJsonBody(request, config.maxBodyBytes ?? DEFAULT_MAX_BODY_BYTES);
        const parsed = config.body.safeParse(raw);
        if (!parsed.success) throw zodProblem(parsed.error, 'body');
        body = parsed.data;
      } else if (request.headers.get('content-length') && Number(request.headers.get('content-length')) > 0 && request.method !== 'GET') {
        const limit = config.maxBodyBytes ?? DEFAULT_MAX_BODY_BYTES;
        if (Number(request.headers.get('content-length')) > limit) throw payloadTooLarge(limit);
        throw badRequest('This request takes no body; send it without one.');
      }

      const actor = config.access === 'public' ? null : await actorFromRequest(request);
      if (config.access !== 'public' && !actor) throw unauthenticated();

      let access: StudioAccess | null = null;
      if (typeof config.access === 'object') {
        const slug = (params.data as { studio?: unknown }).studio;
        if (typeof slug !== 'string') throw new Error('studio-scoped route without a studio path parameter');
        access = await authorize(actor!, slug, config.access.studioAction);
      }

      return await config.handler({
        request,
        params: params.data,
        body: body as never,
        query: query as never,
        actor,
        access,
      });
    } catch (error) {
      return problemResponse(error);
    }
  };
}

/** A JSON response with the given status. */
export function json(data: unknown, status = 200): Response {
  return Response.json(data, { status });
}
