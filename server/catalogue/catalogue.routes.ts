import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import {
  AdapterNeedsDto,
  CompatibilityOverrideDto,
  ImageOrderDto,
  ProductInputDto,
  ProductListQueryDto,
  SpringGeometryInputDto,
  StaffProductListQueryDto,
  StockUpdateDto,
} from '../../shared/catalogue';
import type { Config } from '../config';
import { AppError } from '../errors';
import { requireRole, requireUser } from '../http/auth';
import { parseBody, parseQuery, uuidParam } from '../http/validate';
import { imageNamePattern } from '../uploads/image-storage';
import { imageStorageFor } from '../uploads/image-storage-for';
import * as catalogue from './catalogue.service';
import * as compatibility from './compatibility.service';
import { springGeometry } from './spring-geometry';

export function publicProductRoutes(): Router {
  const r = Router();
  r.get('/', async (req, res) => {
    res.json(await catalogue.listProducts(await parseQuery(ProductListQueryDto, req.query), 'public'));
  });
  r.get('/:id', async (req, res) => {
    res.json(await catalogue.getProduct(uuidParam(req.params.id, 'The product'), 'public'));
  });
  r.get('/:id/bikes', async (req, res) => {
    res.json({ items: await compatibility.bikesForSpring(uuidParam(req.params.id, 'The product')) });
  });
  return r;
}

/** One image per request, in field "image", no larger than the configured limit. */
function imageUpload(config: Config): RequestHandler {
  // preservePath keeps what the client sent, so a name with a path is refused rather than quietly cut.
  const upload = multer({ storage: multer.memoryStorage(), preservePath: true, limits: { fileSize: config.uploadMaxBytes, files: 1, fields: 5, parts: 6 } }).single('image');
  return (req, res, next) => {
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(new AppError('too-large', `An image may be at most ${Math.floor(config.uploadMaxBytes / 1024)} KiB.`, { image: 'The file is too large.' }));
        return next(AppError.validation('Send one image in the field "image".', { image: err.message }));
      }
      // busboy's own complaints (a body that is not multipart, a broken boundary) are the sender's fault.
      if (err instanceof Error) return next(AppError.validation('Send the image as multipart/form-data.', { image: err.message }));
      next(err);
    });
  };
}

export function staffProductRoutes(config: Config): Router {
  const r = Router();
  const storage = imageStorageFor(config);
  r.use(requireRole('staff', 'admin'));
  const id = (v: unknown) => uuidParam(v, 'The product');

  r.get('/', async (req, res) => {
    res.json(await catalogue.listProducts(await parseQuery(StaffProductListQueryDto, req.query), 'staff'));
  });
  r.get('/:id', async (req, res) => {
    res.json(await catalogue.getProduct(id(req.params.id), 'staff'));
  });
  r.post('/', async (req, res) => {
    const dto = await parseBody(ProductInputDto, req.body);
    res.status(201).json(await catalogue.createProduct(requireUser(req).id, dto));
  });
  r.put('/:id', async (req, res) => {
    const productId = id(req.params.id);
    const dto = await parseBody(ProductInputDto, req.body);
    res.json(await catalogue.updateProduct(requireUser(req).id, productId, dto));
  });
  r.delete('/:id', async (req, res) => {
    await catalogue.deleteProduct(requireUser(req).id, id(req.params.id), storage);
    res.status(204).end();
  });
  r.patch('/:id/stock', async (req, res) => {
    const productId = id(req.params.id);
    const dto = await parseBody(StockUpdateDto, req.body);
    res.json(await catalogue.updateStock(requireUser(req).id, productId, dto));
  });
  r.post('/:id/images', imageUpload(config), async (req, res) => {
    const file = req.file ? { originalName: req.file.originalname, bytes: req.file.buffer } : undefined;
    res.status(201).json(await catalogue.addProductImage(requireUser(req).id, id(req.params.id), file, storage));
  });
  r.put('/:id/images/order', async (req, res) => {
    const productId = id(req.params.id);
    const dto = await parseBody(ImageOrderDto, req.body);
    res.json(await catalogue.reorderProductImages(requireUser(req).id, productId, dto));
  });
  r.delete('/:id/images/:imageId', async (req, res) => {
    res.json(await catalogue.deleteProductImage(requireUser(req).id, id(req.params.id), uuidParam(req.params.imageId, 'The image'), storage));
  });
  return r;
}

/** The spring form's helpers and the fitment ↔ spring compatibility table. */
export function staffCatalogueRoutes(): Router {
  const r = Router();
  r.use(requireRole('staff', 'admin'));
  r.get('/spring-options', (_req, res) => {
    res.json(catalogue.springOptions());
  });
  r.post('/spring-geometry', async (req, res) => {
    const dto = await parseBody(SpringGeometryInputDto, req.body);
    res.json(springGeometry(dto, dto.rateNPerMm));
  });
  const ids = (p: Record<string, unknown>) => ({ fitmentId: uuidParam(p.fitmentId, 'The fitment'), productId: uuidParam(p.productId, 'The spring') });
  r.get('/fitments/:fitmentId/compatibility', async (req, res) => {
    res.json(await compatibility.fitmentCompatibility(uuidParam(req.params.fitmentId, 'The fitment')));
  });
  r.put('/fitments/:fitmentId/springs/:productId/override', async (req, res) => {
    const { fitmentId, productId } = ids(req.params);
    const dto = await parseBody(CompatibilityOverrideDto, req.body);
    res.json(await compatibility.setOverride(requireUser(req).id, fitmentId, productId, dto));
  });
  r.delete('/fitments/:fitmentId/springs/:productId/override', async (req, res) => {
    const { fitmentId, productId } = ids(req.params);
    res.json(await compatibility.clearOverride(requireUser(req).id, fitmentId, productId));
  });
  r.put('/fitments/:fitmentId/springs/:productId/adapters', async (req, res) => {
    const { fitmentId, productId } = ids(req.params);
    const dto = await parseBody(AdapterNeedsDto, req.body);
    res.json(await compatibility.setAdapters(requireUser(req).id, fitmentId, productId, dto));
  });
  return r;
}

/** Serves product images by their generated names; a name never changes content, so it caches for a year. */
export function productImageFiles(config: Config): Router {
  const r = Router();
  const storage = imageStorageFor(config);
  r.get('/:name', async (req, res, next) => {
    const name = String(req.params.name);
    const ext = imageNamePattern.exec(name)?.[1];
    const bytes = ext ? await storage.read(name) : undefined;
    if (!ext || !bytes) return next(AppError.notFound('The image'));
    const type = Object.entries(catalogue.imageTypes).find(([, e]) => e === ext)![0];
    res.setHeader('Content-Type', type);
    res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Content-Security-Policy', "default-src 'none'; sandbox");
    res.send(bytes);
  });
  return r;
}

