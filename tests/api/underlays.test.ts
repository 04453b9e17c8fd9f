import { existsSync, mkdtempSync, readFileSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cleanFilename, sniffImage, UNDERLAY_MAX_BYTES } from '../../server/services/underlays.service';
import { makeScheme } from './helpers/schemes-fixture';
import { createTestApp, type Agent, type TestApp } from './helpers/test-app';
import { jpegHeader, tinyPng } from './helpers/underlay-images';
import { manyPagePdf, testPdf } from './helpers/underlay-pdfs';

let t: TestApp;
let uploadDir: string;
let schemeId: string;
let foreignSchemeId: string;

beforeAll(async () => {
  uploadDir = mkdtempSync(join(tmpdir(), 'baywright-underlays-'));
  t = await createTestApp({ uploadDir });
  schemeId = (await makeScheme(t)).schemeId;
  foreignSchemeId = (await makeScheme(t, { firm: 'foreign' })).schemeId;
});

afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
  rmSync(uploadDir, { recursive: true, force: true });
});

const stored = () => (existsSync(join(uploadDir, 'underlays')) ? readdirSync(join(uploadDir, 'underlays')) : []);

function upload(agent: Agent, id: string, file: Buffer | null, filename = 'level-2-plan.png', level = 'L2', contentType?: string, page?: string) {
  let req = agent.post(`/api/schemes/${id}/underlays`).field('level', level);
  if (page !== undefined) req = req.field('page', page);
  return file ? req.attach('file', file, contentType ? { filename, contentType } : filename) : req;
}

describe('underlays API: upload', () => {
  it('when an engineer uploads a 3 × 2 px PNG for level L2, then 201, the row and the file are stored with size from the header', async () => {
    const png = tinyPng(3, 2);
    const before = stored().length;
    const res = await upload(t.agents.engineer, schemeId, png);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const u = res.body.underlay;
    expect(u).toMatchObject({
      schemeId,
      levelId: 'L2',
      filename: 'level-2-plan.png',
      mime: 'image/png',
      bytes: png.length,
      width_px: 3,
      height_px: 2,
      // Default placement: bottom-left corner on the plan origin at 0.05 ft/px, so top-left y = 2 × 0.05.
      placement: { origin_ft: [0, 0.1], scale_ft_per_px: 0.05, rotation_deg: 0 },
      opacity: 0.5,
      visible: true,
      imageUrl: `/api/underlays/${u.id}/image`,
      createdBy: t.seed.userIds.engineer,
    });
    const row = await t.ctx.db.models.Underlay.findByPk(u.id);
    expect(row?.get({ plain: true })).toMatchObject({ schemeId, levelId: 'L2', mime: 'image/png', widthPx: 3, heightPx: 2, bytes: png.length });
    expect(stored().length).toBe(before + 1);
    const onDisk = readFileSync(join(uploadDir, 'underlays', row!.getDataValue('storageKey')));
    expect(onDisk.equals(png)).toBe(true);
  });

  it('when a PNG is named .jpg and sent as image/jpeg, then the content decides: stored as image/png', async () => {
    const res = await upload(t.agents.owner, schemeId, tinyPng(4, 4), 'scan.jpg', 'L2', 'image/jpeg');
    expect(res.status).toBe(201);
    expect(res.body.underlay).toMatchObject({ mime: 'image/png', width_px: 4, height_px: 4, filename: 'scan.jpg' });
  });

  it('when a text file is named .png and sent as image/png, then 415 and nothing is stored', async () => {
    const before = stored().length;
    const rows = await t.ctx.db.models.Underlay.count();
    const res = await upload(t.agents.engineer, schemeId, Buffer.from('this is not an image, only words\n'), 'plan.png', 'L2', 'image/png');
    expect(res.status).toBe(415);
    expect(res.body.error).toMatchObject({ code: 'unsupported_media_type', message: expect.stringContaining('not a PNG or JPEG image or a PDF') });
    expect(res.body.error.fields.file).toBeDefined();
    expect(stored().length).toBe(before);
    expect(await t.ctx.db.models.Underlay.count()).toBe(rows);
  });

  it('when a real PNG carries a second file after its end, then 415 names the hidden bytes and nothing is stored', async () => {
    const before = stored().length;
    const rows = await t.ctx.db.models.Underlay.count();
    const polyglot = Buffer.concat([tinyPng(2, 2), Buffer.from('<script>alert(document.cookie)</script>')]);
    const res = await upload(t.agents.engineer, schemeId, polyglot, 'plan.png', 'L2', 'image/png');
    expect(res.status).toBe(415);
    expect(res.body.error).toMatchObject({ code: 'unsupported_media_type', message: expect.stringContaining('39 bytes follow the IEND chunk') });
    expect(res.body.error.fields.file).toMatch(/IEND/);
    expect(stored().length).toBe(before);
    expect(await t.ctx.db.models.Underlay.count()).toBe(rows);
  });


  it('when the file is larger than 10 MB, then 413 with a clear message and nothing is stored', async () => {
    const before = stored().length;
    const big = Buffer.concat([tinyPng(2, 2), Buffer.alloc(UNDERLAY_MAX_BYTES + 1 - tinyPng(2, 2).length + 1)]);
    expect(big.length).toBeGreaterThan(UNDERLAY_MAX_BYTES);
    const res = await upload(t.agents.engineer, schemeId, big, 'huge.png');
    expect(res.status).toBe(413);
    expect(res.body.error).toMatchObject({ code: 'payload_too_large', message: expect.stringContaining('larger than 10 MB') });
    expect(stored().length).toBe(before);
  });

  it('when a drafter or a manager uploads, then 403 and nothing is stored', async () => {
    const before = stored().length;
    for (const role of ['drafter', 'manager'] as const) {
      const res = await upload(t.agents[role], schemeId, tinyPng(2, 2));
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
    }
    expect(stored().length).toBe(before);
  });

  it("when another firm uploads to this firm's scheme, then 404 and nothing is stored", async () => {
    const before = stored().length;
    const res = await upload(t.otherOwner, schemeId, tinyPng(2, 2));
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
    expect(stored().length).toBe(before);
  });

  it('when the level is not a level of the scheme, or the file is missing, then 400 naming the field', async () => {
    const badLevel = await upload(t.agents.engineer, schemeId, tinyPng(2, 2), 'a.png', 'L9');
    expect(badLevel.status).toBe(400);
    expect(badLevel.body.error.fields.level).toBe('No level "L9" in this scheme');
    const noFile = await upload(t.agents.engineer, schemeId, null);
    expect(noFile.status).toBe(400);
    expect(noFile.body.error.fields.file).toBe('Choose a PNG or JPEG image or a PDF');
    const wrongPart = await t.agents.engineer.post(`/api/schemes/${schemeId}/underlays`).field('level', 'L2').attach('image', tinyPng(2, 2), 'a.png');
    expect(wrongPart.status).toBe(400);
    expect(wrongPart.body.error.message).toContain('"file"');
  });
});

describe('underlays API: list, image, change, delete', () => {
  let underlayId: string;
  let png: Buffer;

  beforeAll(async () => {
    const own = (await makeScheme(t)).schemeId;
    schemeId = own;
    png = tinyPng(5, 3, [10, 20, 30]);
    const res = await upload(t.agents.engineer, own, png, 'ground.png');
    expect(res.status).toBe(201);
    underlayId = res.body.underlay.id;
  });

  it('when any role of the firm lists the scheme underlays, then it gets them; another firm gets 404', async () => {
    for (const role of ['owner', 'engineer', 'drafter', 'manager'] as const) {
      const res = await t.agents[role].get(`/api/schemes/${schemeId}/underlays`);
      expect(res.status).toBe(200);
      expect(res.body.underlays.map((u: { id: string }) => u.id)).toEqual([underlayId]);
    }
    expect((await t.otherOwner.get(`/api/schemes/${schemeId}/underlays`)).status).toBe(404);
  });

  it('when a drafter asks for the image, then the stored bytes come back as image/png; another firm gets 404', async () => {
    const res = await t.agents.drafter.get(`/api/underlays/${underlayId}/image`).buffer(true).parse((r, cb) => {
      const parts: Buffer[] = [];
      r.on('data', (c: Buffer) => parts.push(c));
      r.on('end', () => cb(null, Buffer.concat(parts)));
    });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('image/png');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect((res.body as Buffer).equals(png)).toBe(true);
    const foreign = await t.otherOwner.get(`/api/underlays/${underlayId}/image`);
    expect(foreign.status).toBe(404);
  });

  it('when an engineer changes placement, opacity and visibility, then they are stored and returned', async () => {
    const res = await t.agents.engineer.patch(`/api/underlays/${underlayId}`).send({
      placement: { origin_ft: [-2.5, 40], scale_ft_per_px: 0.125 },
      opacity: 0.3,
      visible: false,
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.underlay).toMatchObject({ placement: { origin_ft: [-2.5, 40], scale_ft_per_px: 0.125, rotation_deg: 0 }, opacity: 0.3, visible: false });
    const row = await t.ctx.db.models.Underlay.findByPk(underlayId);
    expect(row?.get({ plain: true })).toMatchObject({ originXFt: -2.5, originYFt: 40, scaleFtPerPx: 0.125, opacity: 0.3, visible: false });
  });

  it('when a change is out of range or unknown, then 400 names the field and nothing changes', async () => {
    const opacity = await t.agents.engineer.patch(`/api/underlays/${underlayId}`).send({ opacity: 2 });
    expect(opacity.status).toBe(400);
    expect(opacity.body.error.fields.opacity).toBe('opacity must be from 0 to 1');
    const scale = await t.agents.engineer.patch(`/api/underlays/${underlayId}`).send({ placement: { scale_ft_per_px: 0 } });
    expect(scale.status).toBe(400);
    expect(scale.body.error.fields['placement.scale_ft_per_px']).toMatch(/more than 0/);
    expect((await t.agents.engineer.patch(`/api/underlays/${underlayId}`).send({})).status).toBe(400);
    expect((await t.agents.engineer.patch(`/api/underlays/${underlayId}`).send({ filename: 'x.png' })).status).toBe(400);
    const row = await t.ctx.db.models.Underlay.findByPk(underlayId);
    expect(row?.getDataValue('opacity')).toBe(0.3);
    expect(row?.getDataValue('scaleFtPerPx')).toBe(0.125);
  });

  it('when a drafter changes or deletes, then 403; another firm gets 404', async () => {
    expect((await t.agents.drafter.patch(`/api/underlays/${underlayId}`).send({ opacity: 0.9 })).status).toBe(403);
    expect((await t.agents.manager.delete(`/api/underlays/${underlayId}`)).status).toBe(403);
    expect((await t.otherOwner.patch(`/api/underlays/${underlayId}`).send({ opacity: 0.9 })).status).toBe(404);
    expect((await t.otherOwner.delete(`/api/underlays/${underlayId}`)).status).toBe(404);
    expect(await t.ctx.db.models.Underlay.findByPk(underlayId)).not.toBeNull();
  });

  it('when the stored file has gone missing, then the image answers 404 saying so, not 500', async () => {
    const res = await upload(t.agents.engineer, schemeId, tinyPng(2, 2), 'lost.png');
    const row = await t.ctx.db.models.Underlay.findByPk(res.body.underlay.id);
    rmSync(join(uploadDir, 'underlays', row!.getDataValue('storageKey')));
    const image = await t.agents.engineer.get(`/api/underlays/${res.body.underlay.id}/image`);
    expect(image.status).toBe(404);
    expect(image.body.error.message).toMatch(/image file of this underlay is missing/);
  });

  it('when an engineer deletes the underlay, then 204, the row and the file are gone and the image is 404', async () => {
    const key = (await t.ctx.db.models.Underlay.findByPk(underlayId))!.getDataValue('storageKey');
    expect(stored()).toContain(key);
    const res = await t.agents.engineer.delete(`/api/underlays/${underlayId}`);
    expect(res.status).toBe(204);
    expect(await t.ctx.db.models.Underlay.findByPk(underlayId)).toBeNull();
    expect(stored()).not.toContain(key);
    expect((await t.agents.engineer.get(`/api/underlays/${underlayId}/image`)).status).toBe(404);
  });

  it("when listing another firm's scheme, then 404 even for the owner", async () => {
    expect((await t.agents.owner.get(`/api/schemes/${foreignSchemeId}/underlays`)).status).toBe(404);
  });
});

describe('sniffImage: type and size from the content', () => {
  it('when given a PNG, then its IHDR width and height are read (PNG spec §11.2.2)', () => {
    expect(sniffImage(tinyPng(640, 480))).toEqual({ mime: 'image/png', extension: 'png', widthPx: 640, heightPx: 480 });
  });

  it('when given JPEG headers with a fill byte before SOF0, then the frame size is read (ITU-T T.81 B.2.2)', () => {
    expect(sniffImage(jpegHeader(2480, 3508))).toEqual({ mime: 'image/jpeg', extension: 'jpg', widthPx: 2480, heightPx: 3508 });
  });

  it('when a JPEG has no frame header, or a PNG has no IHDR, then 415 says it may be damaged', () => {
    expect(() => sniffImage(Buffer.from([0xff, 0xd8, 0xff, 0xd9]))).toThrow(/no image frame header/);
    expect(() => sniffImage(Buffer.concat([tinyPng(1, 1).subarray(0, 8), Buffer.alloc(30)]))).toThrow(/no image header \(IHDR\)/);
  });

  it('when an image is wider than 16384 px, then it is refused with the size in the message', () => {
    const wide = tinyPng(1, 1);
    wide.writeUInt32BE(20000, 16); // IHDR width
    expect(() => sniffImage(wide)).toThrow(/20000 × 1 px; the largest side accepted is 16384 px/);
  });

  it('when a file name carries a path or control characters, then only a clean base name is kept', () => {
    expect(cleanFilename('C:\\drawings\\level\u0007 2.png', 'png')).toBe('level 2.png');
    expect(cleanFilename('../../etc/passwd', 'png')).toBe('passwd');
    expect(cleanFilename('', 'jpg')).toBe('underlay.jpg');
  });
});

describe('sniffImage: the whole file is checked, not only its header', () => {
  it('when a PNG has a corrupted byte, is cut short, or has bytes after IEND, then 415 names the damage', () => {
    const good = tinyPng(4, 3);
    expect(sniffImage(good)).toMatchObject({ widthPx: 4, heightPx: 3 });
    const flipped = Buffer.from(good);
    flipped[45] ^= 0xff; // inside the IDAT data
    expect(() => sniffImage(flipped)).toThrow(/chunk IDAT fails its CRC check/);
    expect(() => sniffImage(good.subarray(0, good.length - 12))).toThrow(/ends before its IEND chunk/);
    const hidden = Buffer.concat([good, Buffer.from('<html><script>alert(1)</script></html>')]);
    expect(() => sniffImage(hidden)).toThrow(/38 bytes follow the IEND chunk/);
    try {
      sniffImage(hidden);
    } catch (e) {
      expect((e as { status: number; fields: Record<string, string> }).status).toBe(415);
      expect((e as { fields: Record<string, string> }).fields.file).toMatch(/IEND/);
    }
  });

  it('when a JPEG does not end with its end-of-image marker, then 415; zero padding after it is accepted', () => {
    const good = jpegHeader(800, 600);
    expect(sniffImage(Buffer.concat([good, Buffer.alloc(16)]))).toMatchObject({ widthPx: 800, heightPx: 600 });
    expect(() => sniffImage(good.subarray(0, good.length - 2))).toThrow(/does not end with the end-of-image marker/);
    expect(() => sniffImage(Buffer.concat([good, Buffer.from('PK\u0003\u0004zip')]))).toThrow(/does not end with the end-of-image marker/);
  });
});

describe('underlays API: PDF plans', () => {
  const rowsAndFiles = async () => ({ rows: await t.ctx.db.models.Underlay.count(), files: stored().length });

  it('when an engineer uploads page 2 of a three-sheet PDF, then 201: stored once as uploaded, with page 2 of 3 and that page size in points', async () => {
    // Sheets: ANSI B landscape (1224 × 792 pt), ARCH D landscape (2592 × 1728 pt), letter. ANSI/ASME Y14.1 and ARCH sizes (common practice).
    const pdf = await testPdf({ pages: [[1224, 792], [2592, 1728], [612, 792]] });
    const before = await rowsAndFiles();
    const res = await upload(t.agents.engineer, schemeId, pdf, 'A-201 level 2.pdf', 'L2', 'application/pdf', '2');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.underlay).toMatchObject({
      mime: 'application/pdf', filename: 'A-201 level 2.pdf', bytes: pdf.length, page: 2, pageCount: 3, width_px: 2592, height_px: 1728, locked: false,
      // Bottom-left of the page on the plan origin at the default 0.05 ft per unit: top-left y = 1728 × 0.05.
      placement: { origin_ft: [0, 86.4], scale_ft_per_px: 0.05, rotation_deg: 0 },
    });
    expect(await rowsAndFiles()).toEqual({ rows: before.rows + 1, files: before.files + 1 });
    const row = await t.ctx.db.models.Underlay.findByPk(res.body.underlay.id);
    expect(row?.get({ plain: true })).toMatchObject({ mime: 'application/pdf', pageNumber: 2, pageCount: 3, widthPx: 2592, heightPx: 1728 });
    expect(readFileSync(join(uploadDir, 'underlays', row!.getDataValue('storageKey'))).equals(pdf)).toBe(true);
    expect(row!.getDataValue('storageKey')).toMatch(/\.pdf$/);

    const file = await t.agents.drafter.get(`/api/underlays/${res.body.underlay.id}/image`).buffer(true).parse((r, cb) => {
      const parts: Buffer[] = [];
      r.on('data', (c: Buffer) => parts.push(c));
      r.on('end', () => cb(null, Buffer.concat(parts)));
    });
    expect(file.status).toBe(200);
    expect(file.headers['content-type']).toBe('application/pdf');
    expect(file.headers['content-security-policy']).toBe('sandbox');
    expect((file.body as Buffer).equals(pdf)).toBe(true);
  });

  it('when no page is given, then page 1 is shown; a PDF named .png is still read as a PDF', async () => {
    const res = await upload(t.agents.owner, schemeId, await testPdf({ pages: [[1224, 792], [612, 792]] }), 'plan.png', 'L2', 'image/png');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.underlay).toMatchObject({ mime: 'application/pdf', page: 1, pageCount: 2, width_px: 1224, height_px: 792 });
  });

  it('when the page is out of range, not a number, or given for an image, then 422/400 naming page and nothing is stored', async () => {
    const pdf = await testPdf({ pages: [[612, 792], [612, 792]] });
    const before = await rowsAndFiles();
    const out = await upload(t.agents.engineer, schemeId, pdf, 'a.pdf', 'L2', 'application/pdf', '3');
    expect(out.status).toBe(422);
    expect(out.body.error).toMatchObject({ code: 'invalid_pdf', message: 'Page 3 is not in this PDF, which has 2 pages.', fields: { page: 'Choose a page from 1 to 2' } });
    const zero = await upload(t.agents.engineer, schemeId, pdf, 'a.pdf', 'L2', 'application/pdf', '0');
    expect(zero.status).toBe(400);
    expect(zero.body.error.fields.page).toBe('page must be a whole number from 1');
    const words = await upload(t.agents.engineer, schemeId, pdf, 'a.pdf', 'L2', 'application/pdf', 'two');
    expect(words.status).toBe(400);
    expect(words.body.error.fields.page).toBe('page must be a whole number from 1');
    const image = await upload(t.agents.engineer, schemeId, tinyPng(2, 2), 'a.png', 'L2', 'image/png', '2');
    expect(image.status).toBe(422);
    expect(image.body.error.fields.page).toBe('Only a PDF has pages');
    expect(await rowsAndFiles()).toEqual(before);
  });

  it('when the PDF is malformed, then 422 invalid_pdf names the file and nothing is stored', async () => {
    const before = await rowsAndFiles();
    const truncated = (await testPdf()).subarray(0, 400);
    for (const bad of [Buffer.from('%PDF-1.7\n%\xe2\xe3\xcf\xd3\n1 0 obj\n<<>>\nendobj\n', 'latin1'), truncated]) {
      const res = await upload(t.agents.engineer, schemeId, bad, 'arch.pdf', 'L2', 'application/pdf');
      expect(res.status, JSON.stringify(res.body)).toBe(422);
      expect(res.body.error).toMatchObject({ code: 'invalid_pdf', message: expect.stringContaining('could not be read'), fields: { file: 'Not a readable PDF' } });
    }
    expect(await rowsAndFiles()).toEqual(before);
  });

  it('when the PDF is password-protected or encrypted with an owner password only, then 422 says to upload an unprotected copy', async () => {
    const before = await rowsAndFiles();
    const locked = await upload(t.agents.engineer, schemeId, await testPdf({ userPassword: 'site-office' }), 'secret.pdf', 'L2', 'application/pdf');
    expect(locked.status, JSON.stringify(locked.body)).toBe(422);
    expect(locked.body.error).toMatchObject({ code: 'invalid_pdf', message: expect.stringContaining('password-protected'), fields: { file: 'Password-protected PDFs cannot be used' } });
    const restricted = await upload(t.agents.engineer, schemeId, await testPdf({ ownerPassword: 'architect' }), 'restricted.pdf', 'L2', 'application/pdf');
    expect(restricted.status, JSON.stringify(restricted.body)).toBe(422);
    expect(restricted.body.error.fields.file).toBe('Encrypted PDFs cannot be used');
    expect(await rowsAndFiles()).toEqual(before);
  });

  it('when the PDF has 500 pages, then 422 says at most 200 are accepted; a PDF with no pages is refused too', async () => {
    const before = await rowsAndFiles();
    const big = await upload(t.agents.engineer, schemeId, await manyPagePdf(500), 'set.pdf', 'L2', 'application/pdf');
    expect(big.status).toBe(422);
    expect(big.body.error).toMatchObject({ message: 'The PDF has 500 pages; at most 200 are accepted. Upload only the plan sheets you need.', fields: { file: 'At most 200 pages' } });
    const empty = await upload(t.agents.engineer, schemeId, await testPdf({ pages: [] }), 'empty.pdf', 'L2', 'application/pdf');
    expect(empty.status).toBe(422);
    expect(empty.body.error.fields.file).toMatch(/no pages|Not a readable PDF/);
    expect(await rowsAndFiles()).toEqual(before);
  });

  it('when an engineer picks another page, then the page and its size change; out of range is 422 and nothing changes', async () => {
    const pdf = await testPdf({ pages: [[1224, 792], [2592, 1728]] });
    const id = (await upload(t.agents.engineer, schemeId, pdf, 'b.pdf', 'L2', 'application/pdf')).body.underlay.id;
    const res = await t.agents.engineer.patch(`/api/underlays/${id}`).send({ page: 2 });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.underlay).toMatchObject({ page: 2, pageCount: 2, width_px: 2592, height_px: 1728 });
    const out = await t.agents.engineer.patch(`/api/underlays/${id}`).send({ page: 5 });
    expect(out.status).toBe(422);
    expect(out.body.error.fields.page).toBe('Choose a page from 1 to 2');
    expect((await t.ctx.db.models.Underlay.findByPk(id))?.getDataValue('pageNumber')).toBe(2);
    const png = (await upload(t.agents.engineer, schemeId, tinyPng(2, 2), 'c.png')).body.underlay.id;
    const imagePage = await t.agents.engineer.patch(`/api/underlays/${png}`).send({ page: 2 });
    expect(imagePage.status).toBe(422);
    expect(imagePage.body.error.fields.page).toBe('Only a PDF underlay has pages');
  });

  it('when an underlay is locked, then calibrating or changing page is 409 until it is unlocked; opacity still changes', async () => {
    const id = (await upload(t.agents.engineer, schemeId, await testPdf({ pages: [[612, 792], [612, 792]] }), 'd.pdf', 'L2', 'application/pdf')).body.underlay.id;
    expect((await t.agents.engineer.patch(`/api/underlays/${id}`).send({ locked: true })).body.underlay.locked).toBe(true);
    const move = await t.agents.engineer.patch(`/api/underlays/${id}`).send({ placement: { scale_ft_per_px: 0.1 } });
    expect(move.status).toBe(409);
    expect(move.body.error).toMatchObject({ code: 'underlay_locked', fields: { placement: 'Unlock the underlay first' } });
    expect((await t.agents.engineer.patch(`/api/underlays/${id}`).send({ page: 2 })).status).toBe(409);
    expect((await t.agents.engineer.patch(`/api/underlays/${id}`).send({ opacity: 0.8 })).status).toBe(200);
    const row = await t.ctx.db.models.Underlay.findByPk(id);
    expect(row?.get({ plain: true })).toMatchObject({ scaleFtPerPx: 0.05, pageNumber: 1, opacity: 0.8, locked: true });
    const unlockAndMove = await t.agents.engineer.patch(`/api/underlays/${id}`).send({ locked: false, placement: { scale_ft_per_px: 0.1 } });
    expect(unlockAndMove.status).toBe(200);
    expect(unlockAndMove.body.underlay).toMatchObject({ locked: false, placement: { scale_ft_per_px: 0.1 } });
    expect((await t.agents.drafter.patch(`/api/underlays/${id}`).send({ locked: true })).status).toBe(403);
  });
});
