import type { Request, RequestHandler, Response } from 'express';
import type { ClassConstructor } from 'class-transformer';
import { requireUser } from './auth';
import { bodyAs, queryAs, uuidParam } from './validate';

export const endpointMark = Symbol('loadline.endpoint');

/** What one route takes and gives, stated once: the route parses by it, the API description and the fuzz test read it. */
export interface EndpointSpec {
  summary: string;
  description?: string;
  /** JSON body, parsed into this DTO class. */
  body?: ClassConstructor<object>;
  /** Query string, parsed into this DTO class. */
  query?: ClassConstructor<object>;
  /** Path parameters that are record ids (UUIDs), with what each names; a malformed one is a 404. */
  ids?: Record<string, string>;
  /** A body that is not JSON (a CSV file, an upload). */
  content?: { type: string; description: string; schema?: Record<string, unknown> };
  /** Status of the success reply (200 unless given). */
  status?: number;
  /** A reply that is not JSON, or none (204). */
  reply?: { type: string; description: string } | 'none';
  /** Any signed-in account (roles are stated by the router's requireRole). */
  signedIn?: boolean;
}

type Spec<B, Q, K extends string> = Omit<EndpointSpec, 'body' | 'query' | 'ids'> & {
  body?: ClassConstructor<B>;
  query?: ClassConstructor<Q>;
  ids?: Record<K, string>;
};

export interface EndpointInput<B, Q, K extends string> {
  body: B;
  query: Q;
  ids: Record<K, string>;
}

/**
 * A route handler that checks its ids, query and body by the spec before the use case runs (ids first, so a
 * malformed id is a 404 whatever the body), and carries the spec for the route registry.
 */
export function endpoint<B extends object = Record<string, never>, Q extends object = Record<string, never>, K extends string = never>(
  spec: Spec<B, Q, K>,
  handler: (input: EndpointInput<B, Q, K>, req: Request, res: Response) => unknown,
): RequestHandler {
  const idNames = Object.entries(spec.ids ?? {}) as [K, string][];
  const run: RequestHandler = (req, res) => {
    if (spec.signedIn) requireUser(req);
    const ids = {} as Record<K, string>;
    for (const [name, what] of idNames) ids[name] = uuidParam(req.params[name], what);
    const query = (spec.query ? queryAs(spec.query, req.query) : {}) as Q;
    const body = (spec.body ? bodyAs(spec.body, req.body) : {}) as B;
    return handler({ body, query, ids }, req, res) as Promise<void> | void;
  };
  return Object.assign(run, { [endpointMark]: spec as EndpointSpec });
}

export const specOf = (fn: unknown): EndpointSpec | undefined => (fn as { [endpointMark]?: EndpointSpec } | undefined)?.[endpointMark];
