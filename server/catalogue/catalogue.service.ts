import { createHash } from 'node:crypto';
import { fileTypeFromBuffer } from 'file-type';
import { In, type EntityManager } from 'typeorm';
import type {
  ImageOrderDto,
  Page,
  ProductDto,
  ProductImageDto,
  ProductInputDto,
  SpringDetailsDto,
  SpringOptionsDto,
  StaffProductDto,
  StaffProductListQueryDto,
  StockUpdateDto,
} from '../../shared/catalogue';
import { springEnds, springEndTypes } from '../../shared/catalogue';
import { catalogueSolidStress, SPRING_MATERIALS } from '../../shared/engine';
import { recordAudit } from '../audit/audit.service';
import { AppDataSource } from '../db/data-source';
import { AppError } from '../errors';
import { Fitment } from '../fitment/Fitment.entity';
import { likePattern, orderPage } from '../fitment/fitment.service';
import type { ImageStorage } from '../uploads/image-storage';
import { catalogueChanged } from './catalogue-cache';
import { fitsSql } from './compatibility.service';
import { renderMarkdown } from './markdown';
import { Product } from './Product.entity';
import { ProductImage } from './ProductImage.entity';
import { rateMismatchPct, springGeometry } from './spring-geometry';
import { countStockTo, isShortOfStock, recordStockMovement } from '../stock/stock-ledger';
import { rateInUnits } from './units';

const products = (em: EntityManager = AppDataSource.manager) => em.getRepository(Product);
const images = (em: EntityManager = AppDataSource.manager) => em.getRepository(ProductImage);

export const imageUrl = (fileName: string) => `/files/product-images/${fileName}`;

function toImageDto(i: ProductImage): ProductImageDto {
  return { id: i.id, url: imageUrl(i.fileName), contentType: i.contentType, sizeBytes: i.sizeBytes, position: i.position };
}

function toSpringDto(p: Product): SpringDetailsDto | null {
  if (p.kind !== 'spring' || p.springEnd === null) return null;
  const rate = p.rateNPerMm!;
  const computed = p.computedRateNPerMm!;
  const deviation = ((rate - computed) / computed) * 100;
  return {
    end: p.springEnd,
    rateNPerMm: rate,
    rate: rateInUnits(rate),
    freeLengthMm: p.freeLengthMm!,
    innerDiameterMm: p.innerDiameterMm!,
    outerDiameterMm: p.outerDiameterMm!,
    wireDiameterMm: p.wireDiameterMm!,
    totalCoils: p.totalCoils!,
    endType: p.endType!,
    material: p.material!,
    solidLengthMm: p.solidLengthMm ?? p.computedSolidLengthMm!,
    geometry: {
      computedRateNPerMm: computed,
      computedSolidLengthMm: p.computedSolidLengthMm!,
      rateDeviationPct: deviation,
      rateMismatch: Math.abs(deviation) > rateMismatchPct,
      springIndex: p.springIndex!,
      activeCoils: p.activeCoils!,
      solidStress: catalogueSolidStress({
        material: p.material!,
        wireDiameterMm: p.wireDiameterMm!,
        outerDiameterMm: p.outerDiameterMm!,
        computedRateNPerMm: computed,
        freeLengthMm: p.freeLengthMm!,
        solidLengthMm: p.solidLengthMm ?? p.computedSolidLengthMm!,
      }),
    },
  };
}

export function toProductDto(p: Product, imgs: ProductImage[]): ProductDto {
  return {
    id: p.id,
    sku: p.sku,
    name: p.name,
    kind: p.kind,
    description: p.description,
    descriptionHtml: renderMarkdown(p.description),
    priceCents: p.priceCents,
    currency: p.currency,
    inStock: p.stockOnHand > 0,
    images: imgs.map(toImageDto),
    spring: toSpringDto(p),
  };
}

export function toStaffProductDto(p: Product, imgs: ProductImage[]): StaffProductDto {
  return {
    ...toProductDto(p, imgs),
    stockOnHand: p.stockOnHand,
    binLocation: p.binLocation,
    active: p.active,
    createdAt: p.createdAt.toISOString(),
    updatedAt: p.updatedAt.toISOString(),
  };
}

async function imagesOf(ids: string[], em?: EntityManager): Promise<Map<string, ProductImage[]>> {
  const out = new Map<string, ProductImage[]>(ids.map((id) => [id, []]));
  if (!ids.length) return out;
  const rows = await images(em).find({ where: { productId: In(ids) }, order: { position: 'ASC', createdAt: 'ASC' } });
  for (const r of rows) out.get(r.productId)?.push(r);
  return out;
}

const sortColumns: Record<string, string> = {
  name: 'p.name',
  sku: 'p.sku',
  price: 'p.priceCents',
  rate: 'p.rateNPerMm',
  stock: 'p.stockOnHand',
  updatedAt: 'p.updatedAt',
};

/** The shop's and the back office's product list: filtered, sorted, one page. */
export async function listProducts(q: StaffProductListQueryDto, view: 'public' | 'staff'): Promise<Page<ProductDto | StaffProductDto>> {
  const page = q.page ?? 1;
  const pageSize = q.pageSize ?? 20;
  const qb = products().createQueryBuilder('p');
  if (view === 'public') qb.andWhere('p.active = true');
  else if (q.active !== undefined) qb.andWhere('p.active = :active', { active: q.active === 'true' });
  if (q.kind) qb.andWhere('p.kind = :kind', { kind: q.kind });
  if (q.end) qb.andWhere('p.spring_end = :end', { end: q.end });
  if (q.minRate !== undefined) qb.andWhere('p.rate_n_per_mm >= :minRate', { minRate: q.minRate });
  if (q.maxRate !== undefined) qb.andWhere('p.rate_n_per_mm <= :maxRate', { maxRate: q.maxRate });
  if (q.inStock !== undefined) qb.andWhere(q.inStock === 'true' ? 'p.stock_on_hand > 0' : 'p.stock_on_hand = 0');
  if (q.q) qb.andWhere("(p.name || ' ' || p.sku) ILIKE :q", { q: likePattern(q.q.trim()) });
  if (q.fitmentId) {
    if (!(await AppDataSource.getRepository(Fitment).existsBy({ id: q.fitmentId }))) throw AppError.notFound('The fitment');
    qb.andWhere(`EXISTS (SELECT 1 FROM fitments f LEFT JOIN spring_fit_overrides o ON o.fitment_id = f.id AND o.product_id = p.id WHERE f.id = :fitmentId AND ${fitsSql('p', 'f', 'o')})`, {
      fitmentId: q.fitmentId,
    });
  }
  orderPage(qb, q.sort ?? 'name', sortColumns, ['p.name', 'p.sku', 'p.id']);
  const [rows, total] = await qb.skip((page - 1) * pageSize).take(pageSize).getManyAndCount();
  const imgs = await imagesOf(rows.map((p) => p.id));
  const to = view === 'staff' ? toStaffProductDto : toProductDto;
  return { items: rows.map((p) => to(p, imgs.get(p.id) ?? [])), total, page, pageSize };
}

export async function getProduct(id: string, view: 'public' | 'staff'): Promise<ProductDto | StaffProductDto> {
  const p = await products().findOneBy({ id });
  if (!p || (view === 'public' && !p.active)) throw AppError.notFound('The product');
  const imgs = (await imagesOf([id])).get(id) ?? [];
  return view === 'staff' ? toStaffProductDto(p, imgs) : toProductDto(p, imgs);
}

async function staffDto(id: string, em?: EntityManager): Promise<StaffProductDto> {
  const p = await products(em).findOneByOrFail({ id });
  return toStaffProductDto(p, (await imagesOf([id], em)).get(id) ?? []);
}

/** Copies a validated input onto a product; the engine computes a spring's rate and solid length from its geometry. */
export function applyProductInput(p: Product, dto: ProductInputDto): void {
  if (dto.kind !== 'spring' && dto.spring != null) {
    throw AppError.validation('Only springs have spring details.', { spring: 'Only springs have spring details; leave them out for this kind.' });
  }
  Object.assign(p, {
    sku: dto.sku,
    name: dto.name.trim(),
    kind: dto.kind,
    description: dto.description ?? '',
    priceCents: dto.priceCents,
    currency: 'EUR' as const,
    binLocation: (dto.binLocation ?? '').trim(),
    active: dto.active,
  });
  const s = dto.spring;
  if (dto.kind === 'spring' && !s) throw AppError.validation('Give the spring details.', { spring: 'Give the spring details.' });
  if (dto.kind !== 'spring' || !s) {
    Object.assign(p, {
      springEnd: null, rateNPerMm: null, freeLengthMm: null, innerDiameterMm: null, outerDiameterMm: null, wireDiameterMm: null,
      totalCoils: null, endType: null, material: null, solidLengthMm: null, computedRateNPerMm: null, computedSolidLengthMm: null,
      springIndex: null, activeCoils: null,
    });
    return;
  }
  let g;
  try {
    g = springGeometry(s, s.rateNPerMm, s.solidLengthMm);
  } catch (e) {
    // The geometry's field errors belong to the nested spring fields of this form.
    if (e instanceof AppError && e.fields) throw AppError.validation(e.message, Object.fromEntries(Object.entries(e.fields).map(([k, v]) => [`spring.${k}`, v])));
    throw e;
  }
  const inner = s.innerDiameterMm ?? g.innerDiameterMm;
  if (Math.abs(inner - g.innerDiameterMm) > 0.5) {
    throw AppError.validation('The diameters do not agree.', {
      'spring.innerDiameterMm': `Outer diameter − 2 × wire is ${g.innerDiameterMm.toFixed(1)} mm; the inner diameter should be within 0.5 mm of it.`,
    });
  }
  Object.assign(p, {
    springEnd: s.end,
    rateNPerMm: s.rateNPerMm,
    freeLengthMm: s.freeLengthMm,
    innerDiameterMm: inner,
    outerDiameterMm: s.outerDiameterMm,
    wireDiameterMm: s.wireDiameterMm,
    totalCoils: s.totalCoils,
    endType: s.endType,
    material: s.material,
    solidLengthMm: s.solidLengthMm ?? null,
    computedRateNPerMm: g.computedRateNPerMm,
    computedSolidLengthMm: g.computedSolidLengthMm,
    springIndex: g.springIndex,
    activeCoils: g.activeCoils,
  });
}

const skuTaken = () => new AppError('conflict', 'Another product has this SKU.', { sku: 'Another product has this SKU.' });

async function saveProduct(em: EntityManager, p: Product): Promise<Product> {
  try {
    return await em.transaction((inner) => inner.save(p));
  } catch (e) {
    if ((e as { code?: string }).code === '23505') throw skuTaken();
    throw e;
  }
}

/** Staff add a product; a spring's geometry is checked against its stated rate. */
export async function createProduct(actorId: string, dto: ProductInputDto): Promise<StaffProductDto> {
  const out = await AppDataSource.transaction(async (em) => {
    const p = products(em).create();
    applyProductInput(p, dto);
    const saved = await saveProduct(em, p);
    await countStockTo(em, saved.id, dto.stockOnHand, { actorId, note: 'opening count' });
    const after = await staffDto(saved.id, em);
    await recordAudit(em, { actorId, entityType: 'product', entityId: saved.id, action: 'create', before: null, after });
    return after;
  });
  catalogueChanged();
  return out;
}

async function lockedProduct(em: EntityManager, id: string): Promise<Product> {
  const p = await products(em).findOne({ where: { id }, lock: { mode: 'pessimistic_write' } });
  if (!p) throw AppError.notFound('The product');
  return p;
}

export async function updateProduct(actorId: string, id: string, dto: ProductInputDto): Promise<StaffProductDto> {
  const out = await AppDataSource.transaction(async (em) => {
    const p = await lockedProduct(em, id);
    const before = await staffDto(id, em);
    applyProductInput(p, dto);
    await saveProduct(em, p);
    await countStockTo(em, id, dto.stockOnHand, { actorId, note: 'product edited' });
    const after = await staffDto(id, em);
    await recordAudit(em, { actorId, entityType: 'product', entityId: id, action: 'update', before, after });
    return after;
  });
  catalogueChanged();
  return out;
}

/** A stock take sets the count; a delivery or a breakage changes it by an amount. Either way one ledger row and one audited transaction. */
export async function updateStock(actorId: string, id: string, dto: StockUpdateDto): Promise<StaffProductDto> {
  const out = await AppDataSource.transaction(async (em) => {
    const p = await lockedProduct(em, id);
    const before = { stockOnHand: p.stockOnHand, binLocation: p.binLocation };
    const note = dto.reason?.trim() || (dto.change !== undefined ? 'stock change' : 'stock take');
    try {
      if (dto.change !== undefined) await recordStockMovement(em, { productId: id, quantity: dto.change, reason: 'adjustment', note, actorId });
      else await countStockTo(em, id, dto.stockOnHand!, { actorId, note });
    } catch (e) {
      if (!isShortOfStock(e)) throw e;
      const { available, wanted } = e.details;
      throw new AppError('conflict', `Only ${available} on hand: taking out ${wanted} would leave ${available - wanted}, and stock cannot go below 0.`, { change: `Only ${available} on hand now.` });
    }
    if (dto.binLocation !== undefined && dto.binLocation.trim() !== p.binLocation) await products(em).update({ id }, { binLocation: dto.binLocation.trim() });
    const now = await products(em).findOneByOrFail({ id });
    const after = { stockOnHand: now.stockOnHand, binLocation: now.binLocation };
    const why = dto.reason?.trim() ? { reason: dto.reason.trim() } : {};
    const change = dto.change !== undefined ? { change: dto.change } : {};
    await recordAudit(em, { actorId, entityType: 'product', entityId: id, action: 'update', before, after: { ...after, ...change, ...why } });
    return staffDto(id, em);
  });
  catalogueChanged();
  return out;
}

export async function deleteProduct(actorId: string, id: string, storage: ImageStorage): Promise<void> {
  const fileNames = await AppDataSource.transaction(async (em) => {
    await lockedProduct(em, id);
    const before = await staffDto(id, em);
    const [{ n }] = (await em.query(`SELECT count(*)::int AS n FROM adapter_needs WHERE adapter_id = $1`, [id])) as [{ n: number }];
    if (n > 0) throw new AppError('conflict', `Springs still need this adapter on ${n} fitment(s); remove it from them first, or make it inactive.`);
    const names = (await images(em).findBy({ productId: id })).map((i) => i.fileName);
    await products(em).delete({ id });
    await recordAudit(em, { actorId, entityType: 'product', entityId: id, action: 'delete', before, after: null });
    return names;
  });
  catalogueChanged();
  await removeUnusedFiles(storage, fileNames);
}

// Names are content-addressed, so two products may share a file; it goes only when no row uses it.
async function removeUnusedFiles(storage: ImageStorage, names: string[]): Promise<void> {
  for (const name of new Set(names)) {
    if (!(await images().existsBy({ fileName: name }))) await storage.remove(name);
  }
}

export const imageTypes: Record<string, string> = {
  'image/png': 'png',
  'image/jpeg': 'jpg',
  'image/webp': 'webp',
  'image/gif': 'gif',
  'image/avif': 'avif',
};

export interface UploadedFile {
  originalName: string;
  bytes: Buffer;
}

/** Adds an image at the end of a product's gallery; its type is read from the bytes, not the name or header. */
export async function addProductImage(actorId: string, id: string, file: UploadedFile | undefined, storage: ImageStorage): Promise<StaffProductDto> {
  if (!file) throw AppError.validation('Choose an image file.', { image: 'Choose an image file (field "image").' });
  if (/[/\\]|\.\./.test(file.originalName) || file.originalName.includes('\0')) {
    throw AppError.validation('The file name may not contain a path.', { image: 'The file name may not contain a path.' });
  }
  const type = await fileTypeFromBuffer(file.bytes);
  const ext = type ? imageTypes[type.mime] : undefined;
  if (!type || !ext) throw AppError.validation('This file is not a PNG, JPEG, WebP, GIF or AVIF image.', { image: 'This file is not a PNG, JPEG, WebP, GIF or AVIF image.' });
  const fileName = `${createHash('sha256').update(file.bytes).digest('hex')}.${ext}`;
  if (!(await products().existsBy({ id }))) throw AppError.notFound('The product');
  // Bytes first: a row never points at a file that is not there.
  await storage.save(fileName, file.bytes);
  const out = await AppDataSource.transaction(async (em) => {
    await lockedProduct(em, id);
    const count = await images(em).countBy({ productId: id });
    if (count >= 50) throw new AppError('conflict', 'A product has at most 50 images.');
    const img = await images(em).save(images(em).create({ productId: id, fileName, contentType: type.mime, sizeBytes: file.bytes.length, position: count }));
    await recordAudit(em, { actorId, entityType: 'product', entityId: id, action: 'update', before: null, after: { imageAdded: toImageDto(img) } });
    return staffDto(id, em);
  });
  catalogueChanged();
  return out;
}

export async function reorderProductImages(actorId: string, id: string, dto: ImageOrderDto): Promise<StaffProductDto> {
  const out = await AppDataSource.transaction(async (em) => {
    await lockedProduct(em, id);
    const current = await images(em).find({ where: { productId: id }, order: { position: 'ASC' } });
    const ids = new Set(current.map((i) => i.id));
    // A UUID in capitals names the same image.
    const order = dto.imageIds.map((x) => x.toLowerCase());
    if (order.length !== ids.size || new Set(order).size !== ids.size || !order.every((x) => ids.has(x))) {
      throw AppError.validation('Give every image of this product exactly once.', { imageIds: 'Give every image of this product exactly once.' });
    }
    for (const [position, imageId] of order.entries()) await images(em).update({ id: imageId }, { position });
    await recordAudit(em, { actorId, entityType: 'product', entityId: id, action: 'update', before: { imageOrder: current.map((i) => i.id) }, after: { imageOrder: order } });
    return staffDto(id, em);
  });
  catalogueChanged();
  return out;
}

export async function deleteProductImage(actorId: string, id: string, imageId: string, storage: ImageStorage): Promise<StaffProductDto> {
  const { out, fileName } = await AppDataSource.transaction(async (em) => {
    await lockedProduct(em, id);
    const img = await images(em).findOneBy({ id: imageId, productId: id });
    if (!img) throw AppError.notFound('The image');
    await images(em).delete({ id: imageId });
    const rest = await images(em).find({ where: { productId: id }, order: { position: 'ASC' } });
    for (const [position, i] of rest.entries()) if (i.position !== position) await images(em).update({ id: i.id }, { position });
    await recordAudit(em, { actorId, entityType: 'product', entityId: id, action: 'update', before: { imageRemoved: toImageDto(img) }, after: null });
    return { out: await staffDto(id, em), fileName: img.fileName };
  });
  catalogueChanged();
  await removeUnusedFiles(storage, [fileName]);
  return out;
}

export function springOptions(): SpringOptionsDto {
  return {
    materials: Object.entries(SPRING_MATERIALS).map(([key, m]) => ({ key, label: m.label })),
    endTypes: [...springEndTypes],
    ends: [...springEnds],
  };
}
