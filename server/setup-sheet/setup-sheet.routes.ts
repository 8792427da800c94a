import { Router, type Response } from 'express';
import { OrderSheetQueryDto, SetupSheetQueryDto } from '../../shared/setup-sheet/setup-sheet-query.dto';
import type { SetupSheetDto } from '../../shared/setup-sheet/setup-sheet.dto';
import type { Config } from '../config';
import { limiter } from '../http/rate-limit';
import { endpoint } from '../http/endpoint';
import { createBikeCache } from '../recommendations/recommendations.service';
import { setupSheetPdf } from './setup-sheet-pdf';
import { sheetForOrder, sheetForPlan } from './setup-sheet.service';

async function sendPdf(res: Response, sheet: SetupSheetDto): Promise<void> {
  const name = `setup-sheet-${sheet.bikeLabel.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '')}.pdf`;
  res.setHeader('Content-Type', 'application/pdf');
  res.setHeader('Content-Disposition', `attachment; filename="${name}"`);
  res.setHeader('Cache-Control', 'no-store');
  res.send(await setupSheetPdf(sheet));
}

/**
 * The setup sheet as JSON (for the page) and as a PDF, from one builder, for a plan given in the query or for an
 * order's spring set (its owner, or the order link's token).
 */
export function setupSheetRoutes(config: Config): Router {
  const r = Router();
  const cache = createBikeCache(config.catalogueCacheTtlMs);
  r.use(limiter({ name: 'setup-sheet', windowMs: 60_000, limit: config.calcRateLimitPerMinute }));
  const pdf = { type: 'application/pdf', description: 'The setup sheet as a PDF, Inter embedded.' };
  const order = { id: 'The order' };
  r.get('/', endpoint({ summary: 'The setup sheet for a bike, a load and the chosen springs', query: SetupSheetQueryDto }, async ({ query }, _req, res) => {
    res.json(await sheetForPlan(query, cache));
  }));
  r.get('/pdf', endpoint({ summary: 'The setup sheet for a bike, a load and the chosen springs, as a PDF', query: SetupSheetQueryDto, reply: pdf }, async ({ query }, _req, res) => {
    await sendPdf(res, await sheetForPlan(query, cache));
  }));
  r.get('/orders/:id', endpoint({ summary: 'The setup sheet of an order’s spring set, for its owner or link holder', ids: order, query: OrderSheetQueryDto }, async ({ ids, query }, req, res) => {
    res.json(await sheetForOrder(config, req.user, ids.id, query));
  }));
  r.get('/orders/:id/pdf', endpoint({ summary: 'The setup sheet of an order’s spring set, as a PDF', ids: order, query: OrderSheetQueryDto, reply: pdf }, async ({ ids, query }, req, res) => {
    await sendPdf(res, await sheetForOrder(config, req.user, ids.id, query));
  }));
  return r;
}
