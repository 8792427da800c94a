import { Router } from 'express';
import { endpoint } from '../http/endpoint';
import { docsPage } from './docs-page';
import { openApiDocument } from './openapi-document';

/** The API's description: generated from the mounted routes and the DTO classes, so it cannot drift from them. */
export function apiDescriptionRoutes(): Router {
  const r = Router();
  r.get('/openapi.json', endpoint({ summary: 'This description of the API (OpenAPI 3.1)' }, (_input, req, res) => {
    res.json(openApiDocument(req.app));
  }));
  r.get('/docs', endpoint({ summary: 'The API description as a page', reply: { type: 'text/html', description: 'A page listing every route, who may call it and what it takes.' } }, (_input, req, res) => {
    res.type('html').send(docsPage(openApiDocument(req.app), String(res.locals.cspNonce ?? '')));
  }));
  return r;
}
