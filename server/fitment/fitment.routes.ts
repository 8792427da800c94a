import express, { Router } from 'express';
import { FitmentInputDto, FitmentListQueryDto } from '../../shared/catalogue';
import { requireRole, requireUser } from '../http/auth';
import { endpoint } from '../http/endpoint';
import { exportFitmentsCsv, importFitmentsCsv } from './fitment-csv';
import * as fitments from './fitment.service';

/** The bike picker: anyone may read the fitment table. */
export function publicFitmentRoutes(): Router {
  const r = Router();
  r.get('/', endpoint({ summary: 'Bikes in the fitment table, filtered and paged', query: FitmentListQueryDto }, async ({ query }, _req, res) => {
    res.json(await fitments.listFitments(query));
  }));
  r.get('/makes', endpoint({ summary: 'Makes and their models, for the bike picker' }, async (_input, _req, res) => {
    res.json(await fitments.listMakes());
  }));
  r.get('/:id', endpoint({ summary: 'One bike’s fitment: everything the engine needs', ids: { id: 'The fitment' } }, async ({ ids }, _req, res) => {
    res.json(await fitments.getFitment(ids.id));
  }));
  return r;
}

export function staffFitmentRoutes(csvLimitBytes: number): Router {
  const r = Router();
  r.use(requireRole('staff', 'admin'));
  const csvBody = express.text({ type: ['text/csv', 'text/plain', 'application/csv'], limit: csvLimitBytes });

  const csvFile = { type: 'text/csv', description: 'The fitment table as CSV, one bike per line; the header names the columns.' };
  r.get('/', endpoint({ summary: 'Bikes in the fitment table, filtered and paged', query: FitmentListQueryDto }, async ({ query }, _req, res) => {
    res.json(await fitments.listFitments(query));
  }));
  r.get('/export.csv', endpoint({ summary: 'The whole fitment table as CSV', reply: csvFile }, async (_input, _req, res) => {
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', 'attachment; filename="fitments.csv"');
    res.send(await exportFitmentsCsv());
  }));
  r.post('/import/preview', csvBody, endpoint({ summary: 'What importing this CSV would change, without writing', content: csvFile }, async (_input, req, res) => {
    res.json(await importFitmentsCsv(requireUser(req).id, csvText(req.body), { dryRun: true }));
  }));
  r.post('/import', csvBody, endpoint({ summary: 'Import a CSV into the fitment table, all or nothing', content: csvFile }, async (_input, req, res) => {
    res.json(await importFitmentsCsv(requireUser(req).id, csvText(req.body), { dryRun: false }));
  }));
  r.get('/:id', endpoint({ summary: 'One bike’s fitment', ids: { id: 'The fitment' } }, async ({ ids }, _req, res) => {
    res.json(await fitments.getFitment(ids.id));
  }));
  r.post('/', endpoint({ summary: 'Add a bike to the fitment table', body: FitmentInputDto, status: 201 }, async ({ body }, req, res) => {
    res.status(201).json(await fitments.createFitment(requireUser(req).id, body));
  }));
  r.put('/:id', endpoint({ summary: 'Replace a bike’s fitment', ids: { id: 'The fitment' }, body: FitmentInputDto }, async ({ ids, body }, req, res) => {
    res.json(await fitments.updateFitment(requireUser(req).id, ids.id, body));
  }));
  r.delete('/:id', endpoint({ summary: 'Remove a bike from the fitment table', ids: { id: 'The fitment' }, reply: 'none' }, async ({ ids }, req, res) => {
    await fitments.deleteFitment(requireUser(req).id, ids.id);
    res.status(204).end();
  }));
  return r;
}

// express.text leaves the body as {} when the content type is not CSV.
function csvText(body: unknown): string | undefined {
  return typeof body === 'string' ? body : undefined;
}
