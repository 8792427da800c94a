import type { ClassConstructor } from 'class-transformer';

// The route registry reads a route's spec through specOf; the compiled-validation work supplies endpoint(), which
// attaches it. Until that lands, no route carries a spec and the registry reads roles from requireRole alone.
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

export const specOf = (fn: unknown): EndpointSpec | undefined => (fn as { [endpointMark]?: EndpointSpec } | undefined)?.[endpointMark];
