import express, { Router } from 'express';
import { FitmentInputDto, FitmentListQueryDto } from '../../shared/catalogue';
import { requireRole, requireUser } from '../http/auth';
import { parseBody, parseQuery, uuidParam } from '../http/validate';
import { exportFitmentsCsv, importFitmentsCsv } from './fitment-csv';
import * as fitments from './fitment.service';

/** The bike picker: anyone may read the fitment table. */
export function publicFitmentRoutes(): Router {
  const r = Router();
  r.get('/', async (req, res) => {
    res.json(await fitments.listFitments(await parseQuery(FitmentListQueryDto, req.query)));
  });
  r.get('/makes', async (_req, res) => {
    res.json(await fitments.listMakes());
  });
  r.get('/:id', async (req, res) => {
    res.json(await fitments.getFitment(uuidParam(req.params.id, 'The fitment')));
  });
  return r;
}

export function staffFitmentRoutes(csvLimitBytes: number): Router {
  const r = Router();
  r.use(requireRole('staff', 'admin'));
  const csvBody = express.text({ type: ['text/csv', 'text/plain', 'application/csv'], limit: csvLimitBytes });

  r.get('/', async (req, res) => {
    res.json(await fitments.listFitments(await parseQuery(FitmentListQueryDto, req.query)));
  });
  r.get('/export.csv', async (_req, res) => {
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', 'attachment; filename="fitments.csv"');
    res.send(await exportFitmentsCsv());
  });
  r.post('/import/preview', csvBody, async (req, res) => {
    res.json(await importFitmentsCsv(requireUser(req).id, csvText(req.body), { dryRun: true }));
  });
  r.post('/import', csvBody, async (req, res) => {
    res.json(await importFitmentsCsv(requireUser(req).id, csvText(req.body), { dryRun: false }));
  });
  r.get('/:id', async (req, res) => {
    res.json(await fitments.getFitment(uuidParam(req.params.id, 'The fitment')));
  });
  r.post('/', async (req, res) => {
    const dto = await parseBody(FitmentInputDto, req.body);
    res.status(201).json(await fitments.createFitment(requireUser(req).id, dto));
  });
  r.put('/:id', async (req, res) => {
    const id = uuidParam(req.params.id, 'The fitment');
    const dto = await parseBody(FitmentInputDto, req.body);
    res.json(await fitments.updateFitment(requireUser(req).id, id, dto));
  });
  r.delete('/:id', async (req, res) => {
    await fitments.deleteFitment(requireUser(req).id, uuidParam(req.params.id, 'The fitment'));
    res.status(204).end();
  });
  return r;
}

// express.text leaves the body as {} when the content type is not CSV.
function csvText(body: unknown): string | undefined {
  return typeof body === 'string' ? body : undefined;
}
