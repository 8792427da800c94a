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
import { endpoint } from '../http/endpoint';
import { imageNamePattern } from '../uploads/image-storage';
import { imageStorageFor } from '../uploads/image-storage-for';
import * as catalogue from './catalogue.service';
import * as compatibility from './compatibility.service';
import { springGeometry } from './spring-geometry';

export function publicProductRoutes(): Router {
  const r = Router();
  r.get('/', endpoint({ summary: 'Products riders may buy, filtered and paged', query: ProductListQueryDto }, async ({ query }, _req, res) => {
    res.json(await catalogue.listProducts(query, 'public'));
  }));
  r.get('/:id', endpoint({ summary: 'One product as riders see it', ids: { id: 'The product' } }, async ({ ids }, _req, res) => {
    res.json(await catalogue.getProduct(ids.id, 'public'));
  }));
  r.get('/:id/bikes', endpoint({ summary: 'The bikes a spring fits, with the adapters each needs', ids: { id: 'The product' } }, async ({ ids }, _req, res) => {
    res.json({ items: await compatibility.bikesForSpring(ids.id) });
  }));
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
  const id = { id: 'The product' };
  const image = {
    type: 'multipart/form-data',
    description: 'One image (JPEG, PNG or WebP) in the field "image".',
    schema: { type: 'object', properties: { image: { type: 'string', contentMediaType: 'application/octet-stream' } }, required: ['image'] },
  };

  r.get('/', endpoint({ summary: 'Every product with stock and bin, filtered and paged', query: StaffProductListQueryDto }, async ({ query }, _req, res) => {
    res.json(await catalogue.listProducts(query, 'staff'));
  }));
  r.get('/:id', endpoint({ summary: 'One product as staff see it', ids: id }, async ({ ids }, _req, res) => {
    res.json(await catalogue.getProduct(ids.id, 'staff'));
  }));
  r.post('/', endpoint({ summary: 'Add a product', body: ProductInputDto, status: 201 }, async ({ body }, req, res) => {
    res.status(201).json(await catalogue.createProduct(requireUser(req).id, body));
  }));
  r.put('/:id', endpoint({ summary: 'Replace a product (images stay)', ids: id, body: ProductInputDto }, async ({ ids, body }, req, res) => {
    res.json(await catalogue.updateProduct(requireUser(req).id, ids.id, body));
  }));
  r.delete('/:id', endpoint({ summary: 'Delete a product and its images', ids: id, reply: 'none' }, async ({ ids }, req, res) => {
    await catalogue.deleteProduct(requireUser(req).id, ids.id, storage);
    res.status(204).end();
  }));
  r.patch('/:id/stock', endpoint({ summary: 'Set the count on the shelf, or change it by an amount', ids: id, body: StockUpdateDto }, async ({ ids, body }, req, res) => {
    res.json(await catalogue.updateStock(requireUser(req).id, ids.id, body));
  }));
  r.post('/:id/images', imageUpload(config), endpoint({ summary: 'Add an image to a product', ids: id, content: image, status: 201 }, async ({ ids }, req, res) => {
    const file = req.file ? { originalName: req.file.originalname, bytes: req.file.buffer } : undefined;
    res.status(201).json(await catalogue.addProductImage(requireUser(req).id, ids.id, file, storage));
  }));
  r.put('/:id/images/order', endpoint({ summary: 'Put a product’s images in a new order', ids: id, body: ImageOrderDto }, async ({ ids, body }, req, res) => {
    res.json(await catalogue.reorderProductImages(requireUser(req).id, ids.id, body));
  }));
  r.delete('/:id/images/:imageId', endpoint({ summary: 'Remove one image of a product', ids: { ...id, imageId: 'The image' } }, async ({ ids }, req, res) => {
    res.json(await catalogue.deleteProductImage(requireUser(req).id, ids.id, ids.imageId, storage));
  }));
  return r;
}

/** The spring form's helpers and the fitment ↔ spring compatibility table. */
export function staffCatalogueRoutes(): Router {
  const r = Router();
  r.use(requireRole('staff', 'admin'));
  r.get('/spring-options', endpoint({ summary: 'What the spring form’s selects offer' }, (_input, _req, res) => {
    res.json(catalogue.springOptions());
  }));
  r.post('/spring-geometry', endpoint({ summary: 'The spring form’s geometry check as staff type', body: SpringGeometryInputDto }, ({ body }, _req, res) => {
    res.json(springGeometry(body, body.rateNPerMm));
  }));
  const pair = { fitmentId: 'The fitment', productId: 'The spring' };
  r.get('/fitments/:fitmentId/compatibility', endpoint({ summary: 'Every catalogue spring against one bike', ids: { fitmentId: 'The fitment' } }, async ({ ids }, _req, res) => {
    res.json(await compatibility.fitmentCompatibility(ids.fitmentId));
  }));
  r.put('/fitments/:fitmentId/springs/:productId/override', endpoint({ summary: 'Force a spring to fit a bike, or exclude it', ids: pair, body: CompatibilityOverrideDto }, async ({ ids, body }, req, res) => {
    res.json(await compatibility.setOverride(requireUser(req).id, ids.fitmentId, ids.productId, body));
  }));
  r.delete('/fitments/:fitmentId/springs/:productId/override', endpoint({ summary: 'Let the fit window decide again', ids: pair }, async ({ ids }, req, res) => {
    res.json(await compatibility.clearOverride(requireUser(req).id, ids.fitmentId, ids.productId));
  }));
  r.put('/fitments/:fitmentId/springs/:productId/adapters', endpoint({ summary: 'The adapters a spring needs on a bike (the whole list)', ids: pair, body: AdapterNeedsDto }, async ({ ids, body }, req, res) => {
    res.json(await compatibility.setAdapters(requireUser(req).id, ids.fitmentId, ids.productId, body));
  }));
  return r;
}

/** Serves product images by their generated names; a name never changes content, so it caches for a year. */
export function productImageFiles(config: Config): Router {
  const r = Router();
  const storage = imageStorageFor(config);
  const file = { type: 'image/*', description: 'The image bytes, cached for a year.' };
  r.get('/:name', endpoint({ summary: 'A product image by its generated name', reply: file }, async (_input, req, res) => {
    const name = String(req.params.name);
    const ext = imageNamePattern.exec(name)?.[1];
    const bytes = ext ? await storage.read(name) : undefined;
    if (!ext || !bytes) throw AppError.notFound('The image');
    const type = Object.entries(catalogue.imageTypes).find(([, e]) => e === ext)![0];
    res.setHeader('Content-Type', type);
    res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Content-Security-Policy', "default-src 'none'; sandbox");
    res.send(bytes);
  }));
  return r;
}

