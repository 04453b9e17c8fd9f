// Underlays: an architectural plan (PNG or JPEG image, or one page of a PDF) under one level
// of a scheme, to trace framing over. The type is read from the file's CONTENT (magic bytes
// and header; a PDF is opened with pdfjs-dist), never from its name or the browser's mime
// type; the pixel size comes from the header (a PDF page: its size in points). Bytes are
// stored once, as uploaded, on disk under <uploadDir>/underlays/<uuid>.<ext>; the row keeps
// the metadata, the PDF page shown and the placement. The browser renders PDF pages.
// Every lookup goes through the scheme's project to the caller's firm: another firm's scheme
// or underlay is "not found", never forbidden.
import { randomUUID } from 'node:crypto';
import { mkdir, readFile, rm, stat, writeFile } from 'node:fs/promises';
import { basename, join, resolve } from 'node:path';
import type { Model } from 'sequelize';
import { AppError } from '../errors/app-error';
import { isPdf, readPdfPage } from '../pdf/pdf-pages.reader';
import type { Db } from '../models/models';
import type { UnderlayAttributes, UnderlayCreation } from '../models/underlay.model';
import { checkJpegEnd, checkPngStructure, looksLikeJpeg, looksLikePng, unsupportedContent } from './file-content.service';

export const UNDERLAY_MAX_BYTES = 10 * 1024 * 1024;
/** Larger sides do not draw reliably in browser canvases. */
export const UNDERLAY_MAX_SIDE_PX = 16384;
/** A fresh underlay: 0.05 ft per px (a 3000 px scan covers 150 ft) until it is calibrated. */
export const UNDERLAY_DEFAULT_SCALE_FT_PER_PX = 0.05;
export const UNDERLAY_DEFAULT_OPACITY = 0.5;

export type UnderlayMime = 'image/png' | 'image/jpeg' | 'application/pdf';

export interface ImageInfo {
  mime: 'image/png' | 'image/jpeg';
  extension: 'png' | 'jpg';
  widthPx: number;
  heightPx: number;
}

export interface UnderlayPlacement {
  /** Plan coordinates (ft) of the image's top-left pixel. */
  origin_ft: [number, number];
  scale_ft_per_px: number;
  /** Counter-clockwise on the plan about the top-left corner. */
  rotation_deg: number;
}

export interface UnderlayView {
  id: string;
  schemeId: string;
  levelId: string;
  filename: string;
  mime: UnderlayMime;
  bytes: number;
  /** Image pixels; for a PDF, the shown page in points (1/72 in), the unit its placement scales. */
  width_px: number;
  height_px: number;
  /** PDF only: the page shown (1-based) and the document's page count; null for images. */
  page: number | null;
  pageCount: number | null;
  placement: UnderlayPlacement;
  opacity: number;
  visible: boolean;
  /** Locked: the placement cannot change until unlocked. */
  locked: boolean;
  /** The stored file (image or PDF). */
  imageUrl: string;
  createdBy: string | null;
  createdAt: string;
  updatedAt: string;
}

export interface UnderlayPatch {
  placement?: Partial<UnderlayPlacement>;
  opacity?: number;
  visible?: boolean;
  locked?: boolean;
  /** PDF only: show another page. */
  page?: number;
}

const unsupported = (message: string) => unsupportedContent(message);

/** PNG: 8-byte signature, then the IHDR chunk (PNG spec §11.2.2) with width and height. */
function readPng(buf: Buffer): ImageInfo {
  if (buf.length < 33 || buf.toString('latin1', 12, 16) !== 'IHDR') {
    throw unsupported('The file starts like a PNG but has no image header (IHDR); it may be damaged.');
  }
  return { mime: 'image/png', extension: 'png', widthPx: buf.readUInt32BE(16), heightPx: buf.readUInt32BE(20) };
}

/** JPEG: walk the marker segments (ITU-T T.81 Annex B) to the first start-of-frame (SOFn). */
function readJpeg(buf: Buffer): ImageInfo {
  let i = 2;
  while (i + 3 < buf.length) {
    if (buf[i] !== 0xff) break;
    let marker = buf[i + 1];
    while (marker === 0xff && i + 2 < buf.length) {
      i += 1; // fill bytes
      marker = buf[i + 1];
    }
    i += 2;
    if (marker === 0xd8 || marker === 0x01 || (marker >= 0xd0 && marker <= 0xd7)) continue; // no length
    if (marker === 0xd9 || marker === 0xda) break; // end of image or start of scan before any frame
    if (i + 1 >= buf.length) break;
    const length = buf.readUInt16BE(i);
    if (length < 2) break;
    const isSof = marker >= 0xc0 && marker <= 0xcf && marker !== 0xc4 && marker !== 0xc8 && marker !== 0xcc;
    if (isSof) {
      if (i + 7 > buf.length) break;
      return { mime: 'image/jpeg', extension: 'jpg', heightPx: buf.readUInt16BE(i + 3), widthPx: buf.readUInt16BE(i + 5) };
    }
    i += length;
  }
  throw unsupported('The file starts like a JPEG but no image frame header was found; it may be damaged.');
}

/**
 * What an image file is, from its bytes: PNG or JPEG with its pixel size. Anything else
 * answers 415 (PDFs are read by readPdfPage before this is asked).
 */
export function sniffImage(buf: Buffer): ImageInfo {
  let info: ImageInfo;
  if (looksLikePng(buf)) info = readPng(buf);
  else if (looksLikeJpeg(buf)) info = readJpeg(buf);
  else {
    throw unsupported('The file is not a PNG or JPEG image or a PDF (its content was checked, not its name).');
  }
  if (info.widthPx < 1 || info.heightPx < 1) throw unsupported('The image header gives a width or height of zero.');
  if (info.widthPx > UNDERLAY_MAX_SIDE_PX || info.heightPx > UNDERLAY_MAX_SIDE_PX) {
    throw AppError.badRequest(`The image is ${info.widthPx} × ${info.heightPx} px; the largest side accepted is ${UNDERLAY_MAX_SIDE_PX} px.`, {
      file: `Largest side accepted: ${UNDERLAY_MAX_SIDE_PX} px`,
    });
  }
  // The whole file, not only its header: a damaged or disguised file is never stored.
  if (info.mime === 'image/png') checkPngStructure(buf);
  else checkJpegEnd(buf);
  return info;
}

type UnderlayFileInfo = {
  mime: UnderlayMime;
  extension: 'png' | 'jpg' | 'pdf';
  widthPx: number;
  heightPx: number;
  page: number | null;
  pageCount: number | null;
};

/** An image (PNG, JPEG) or a PDF page, by content; `page` is for PDFs only. */
export async function sniffUnderlay(buf: Buffer, page: number | undefined): Promise<UnderlayFileInfo> {
  if (isPdf(buf)) {
    const info = await readPdfPage(buf, page ?? 1);
    // Whole points: a page is a whole number of points in practice (A1 is 2384 × 1684 pt).
    return { mime: 'application/pdf', extension: 'pdf', widthPx: Math.round(info.widthPt), heightPx: Math.round(info.heightPt), page: info.pageNumber, pageCount: info.pageCount };
  }
  const image = sniffImage(buf);
  if (page !== undefined && page !== 1) {
    throw new AppError(422, 'invalid_page', 'Only a PDF has pages; an image is one picture.', { fields: { page: 'Only a PDF has pages' } });
  }
  return { ...image, page: null, pageCount: null };
}

async function readStored(storage: { uploadDir: string }, storageKey: string): Promise<Buffer> {
  try {
    return await readFile(join(underlayDir(storage.uploadDir), basename(storageKey)));
  } catch {
    throw new AppError(404, 'not_found', 'The file of this underlay is missing from the server; delete the underlay and upload it again.');
  }
}

/** The uploaded name, for display only: no path, no control characters, at most 200 characters. */
export function cleanFilename(name: string | undefined, extension: string): string {
  const base = basename((name ?? '').replace(/\\/g, '/'))
    .replace(/[\u0000-\u001f\u007f]/g, '')
    .trim()
    .slice(0, 200);
  return base || `underlay.${extension}`;
}

function underlayDir(uploadDir: string): string {
  return resolve(uploadDir, 'underlays');
}

function toView(row: Model<UnderlayAttributes, UnderlayCreation>): UnderlayView {
  const u = row.get({ plain: true });
  return {
    id: u.id,
    schemeId: u.schemeId,
    levelId: u.levelId,
    filename: u.filename,
    mime: u.mime,
    bytes: u.bytes,
    width_px: u.widthPx,
    height_px: u.heightPx,
    page: u.mime === 'application/pdf' ? (u.pageNumber ?? 1) : null,
    pageCount: u.mime === 'application/pdf' ? (u.pageCount ?? null) : null,
    placement: { origin_ft: [u.originXFt, u.originYFt], scale_ft_per_px: u.scaleFtPerPx, rotation_deg: u.rotationDeg },
    opacity: u.opacity,
    visible: Boolean(u.visible),
    locked: Boolean(u.locked),
    imageUrl: `/api/underlays/${u.id}/image`,
    createdBy: u.createdBy ?? null,
    createdAt: new Date(u.createdAt).toISOString(),
    updatedAt: new Date(u.updatedAt).toISOString(),
  };
}

/** The scheme, if its project belongs to the firm; else 404. */
async function findOwnScheme(db: Db, firmId: string, schemeId: string) {
  const scheme = await db.models.Scheme.findByPk(schemeId);
  if (!scheme) throw AppError.notFound('Scheme');
  const project = await db.models.Project.findOne({ where: { id: scheme.getDataValue('projectId'), firmId } });
  if (!project) throw AppError.notFound('Scheme');
  return scheme;
}

async function findOwnUnderlay(db: Db, firmId: string, id: string) {
  const row = await db.models.Underlay.findByPk(id);
  if (!row) throw AppError.notFound('Underlay');
  try {
    await findOwnScheme(db, firmId, row.getDataValue('schemeId'));
  } catch {
    throw AppError.notFound('Underlay');
  }
  return row;
}

export async function listUnderlays(db: Db, firmId: string, schemeId: string): Promise<UnderlayView[]> {
  await findOwnScheme(db, firmId, schemeId);
  const rows = await db.models.Underlay.findAll({ where: { schemeId }, order: [['levelId', 'ASC'], ['createdAt', 'ASC']] });
  return rows.map(toView);
}

export interface UnderlayUpload {
  levelId: string;
  /** PDF only: the page to show (1-based; default 1). */
  page?: number;
  /** The multipart file part, or null when none was sent. */
  file: { buffer: Buffer; originalName: string | undefined } | null;
}

export async function createUnderlay(
  db: Db,
  storage: { uploadDir: string },
  actor: { firmId: string; userId: string },
  schemeId: string,
  upload: UnderlayUpload,
): Promise<UnderlayView> {
  await findOwnScheme(db, actor.firmId, schemeId);
  if (!upload.file || upload.file.buffer.length === 0) {
    throw AppError.badRequest('Attach the plan as the "file" part (PNG, JPEG or PDF).', { file: 'Choose a PNG or JPEG image or a PDF' });
  }
  const level = await db.models.Level.findOne({ where: { schemeId, elementId: upload.levelId } });
  if (!level) {
    throw AppError.badRequest(`Level "${upload.levelId}" is not a level of this scheme.`, { level: `No level "${upload.levelId}" in this scheme` });
  }
  const info = await sniffUnderlay(upload.file.buffer, upload.page);

  const dir = underlayDir(storage.uploadDir);
  await mkdir(dir, { recursive: true });
  const storageKey = `${randomUUID()}.${info.extension}`;
  const path = join(dir, storageKey);
  await writeFile(path, upload.file.buffer, { flag: 'wx' });
  try {
    const scale = UNDERLAY_DEFAULT_SCALE_FT_PER_PX;
    const row = await db.models.Underlay.create({
      schemeId,
      levelId: upload.levelId,
      filename: cleanFilename(upload.file.originalName, info.extension),
      mime: info.mime,
      bytes: upload.file.buffer.length,
      widthPx: info.widthPx,
      heightPx: info.heightPx,
      pageNumber: info.page,
      pageCount: info.pageCount,
      locked: false,
      storageKey,
      // Bottom-left corner of the image on the plan origin, image above and to the right.
      originXFt: 0,
      originYFt: info.heightPx * scale,
      scaleFtPerPx: scale,
      rotationDeg: 0,
      opacity: UNDERLAY_DEFAULT_OPACITY,
      visible: true,
      createdBy: actor.userId,
    });
    return toView(row);
  } catch (error) {
    await rm(path, { force: true }); // no orphan file when the row could not be written
    throw error;
  }
}

export async function getUnderlayImage(
  db: Db,
  storage: { uploadDir: string },
  firmId: string,
  id: string,
): Promise<{ path: string; mime: UnderlayMime; bytes: number; filename: string }> {
  const row = await findOwnUnderlay(db, firmId, id);
  const u = row.get({ plain: true });
  const path = join(underlayDir(storage.uploadDir), basename(u.storageKey));
  try {
    await stat(path);
  } catch {
    throw new AppError(404, 'not_found', 'The image file of this underlay is missing from the server; delete the underlay and upload it again.');
  }
  return { path, mime: u.mime, bytes: u.bytes, filename: u.filename };
}

export async function updateUnderlay(db: Db, storage: { uploadDir: string }, firmId: string, id: string, patch: UnderlayPatch): Promise<UnderlayView> {
  const row = await findOwnUnderlay(db, firmId, id);
  const u = row.get({ plain: true });
  const changes: Partial<UnderlayAttributes> = {};
  // A locked underlay keeps its place and page; the same request may unlock it first.
  const lockedAfter = patch.locked ?? Boolean(u.locked);
  if (Boolean(u.locked) && lockedAfter && (patch.placement !== undefined || patch.page !== undefined)) {
    const field = patch.placement !== undefined ? 'placement' : 'page';
    throw AppError.conflict('underlay_locked', 'This underlay is locked: unlock it before moving, calibrating or changing its page.', { [field]: 'Unlock the underlay first' });
  }
  if (patch.page !== undefined) {
    if (u.mime !== 'application/pdf') {
      throw new AppError(422, 'invalid_page', 'Only a PDF underlay has pages.', { fields: { page: 'Only a PDF underlay has pages' } });
    }
    const buf = await readStored(storage, u.storageKey);
    const page = await readPdfPage(buf, patch.page);
    changes.pageNumber = page.pageNumber;
    changes.pageCount = page.pageCount;
    changes.widthPx = Math.round(page.widthPt);
    changes.heightPx = Math.round(page.heightPt);
  }
  if (patch.locked !== undefined) changes.locked = patch.locked;
  const p = patch.placement;
  if (p?.origin_ft) {
    changes.originXFt = p.origin_ft[0];
    changes.originYFt = p.origin_ft[1];
  }
  if (p?.scale_ft_per_px !== undefined) changes.scaleFtPerPx = p.scale_ft_per_px;
  if (p?.rotation_deg !== undefined) changes.rotationDeg = p.rotation_deg;
  if (patch.opacity !== undefined) changes.opacity = patch.opacity;
  if (patch.visible !== undefined) changes.visible = patch.visible;
  await row.update(changes);
  return toView(row);
}

export async function deleteUnderlay(db: Db, storage: { uploadDir: string }, firmId: string, id: string): Promise<void> {
  const row = await findOwnUnderlay(db, firmId, id);
  const key = basename(row.getDataValue('storageKey'));
  await row.destroy();
  await rm(join(underlayDir(storage.uploadDir), key), { force: true });
}
