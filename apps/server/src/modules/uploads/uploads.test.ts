import { createWriteStream, existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { once } from 'node:events';
import { chemicalSchema, lotSchema } from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn, stockFactory } from '../../test/factories';
import { testContext } from '../../test/harness';
import { exeBytes, jpegBytes, tinyPdf, tinyPng } from '../../test/sample-files';

const app = () => testContext().app;
let manager = '';
let viewer = '';
let member = '';
const make = stockFactory(() => manager);

beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
  viewer = (await signedIn('viewer')).cookie;
  member = (await signedIn('member')).cookie;
});

function binaryParser(
  res: { on(event: string, listener: (chunk: Buffer) => void): unknown },
  done: (error: Error | null, body: Buffer) => void,
) {
  const chunks: Buffer[] = [];
  res.on('data', (chunk: Buffer) => chunks.push(chunk));
  res.on('end', () => done(null, Buffer.concat(chunks)));
}
const download = (url: string, cookie = viewer) =>
  request(app()).get(url).set('Cookie', cookie).buffer(true).parse(binaryParser);
const uploadTo = (url: string, file: Buffer | string, fileName: string, cookie = manager) =>
  request(app()).post(url).set('Cookie', cookie).attach('file', file, fileName);

/** Files kept in the uploads folder (temporary ones excluded). */
function storedFiles(): string[] {
  const dir = testContext().config.uploadDir;
  return existsSync(dir) ? readdirSync(dir).filter((name) => !name.startsWith('.')) : [];
}
function incomingFiles(): string[] {
  const dir = path.join(testContext().config.uploadDir, '.incoming');
  return existsSync(dir) ? readdirSync(dir) : [];
}

describe('safety data sheets', () => {
  it('when a PDF is uploaded, then it downloads with its original name and identical bytes', async () => {
    const chemical = await make.chemical();
    const pdf = tinyPdf();
    const name = 'Sicherheitsdatenblatt Äthanol (v2).pdf';
    const uploaded = await uploadTo(`/api/chemicals/${chemical.id}/sds`, pdf, name).expect(201);
    const saved = chemicalSchema.parse(uploaded.body);
    expect(saved.sds).toMatchObject({
      fileName: name,
      size: pdf.length,
      contentType: 'application/pdf',
    });
    expect(
      (await request(app()).get(`/api/chemicals/${chemical.id}`).set('Cookie', viewer)).body.sds,
    ).toEqual(saved.sds);

    const response = await download(`/api/chemicals/${chemical.id}/sds`).expect(200);
    expect(response.headers['content-type']).toBe('application/pdf');
    expect(response.headers['content-length']).toBe(String(pdf.length));
    const disposition = response.headers['content-disposition'] as string;
    // An ASCII fallback for old clients, and the exact UTF-8 name (RFC 6266 / 8187).
    expect(disposition).toBe(
      `attachment; filename="Sicherheitsdatenblatt ?thanol (v2).pdf"; filename*=UTF-8''Sicherheitsdatenblatt%20%C3%84thanol%20%28v2%29.pdf`,
    );
    expect(Buffer.compare(response.body as Buffer, pdf)).toBe(0);

    // Stored under a random name, not the person's.
    const files = storedFiles();
    expect(files.some((file) => /^[a-f0-9]{32}\.pdf$/.test(file))).toBe(true);
    expect(files.some((file) => file.includes('thanol'))).toBe(false);
    expect(incomingFiles()).toEqual([]);
  });

  it('when an SDS is replaced and then deleted, then the old files are removed', async () => {
    const chemical = await make.chemical();
    const before = storedFiles().length;
    await uploadTo(`/api/chemicals/${chemical.id}/sds`, tinyPdf(), 'first.pdf').expect(201);
    await uploadTo(`/api/chemicals/${chemical.id}/sds`, tinyPdf(), 'second.pdf').expect(201);
    expect(storedFiles().length).toBe(before + 1);
    const response = await download(`/api/chemicals/${chemical.id}/sds`).expect(200);
    expect(response.headers['content-disposition']).toContain('second.pdf');

    await request(app())
      .delete(`/api/chemicals/${chemical.id}/sds`)
      .set('Cookie', manager)
      .expect(204);
    expect(storedFiles().length).toBe(before);
    const gone = await download(`/api/chemicals/${chemical.id}/sds`).expect(404);
    expect(gone.body.toString()).toMatch(/has no safety data sheet/);
    await request(app())
      .delete(`/api/chemicals/${chemical.id}/sds`)
      .set('Cookie', manager)
      .expect(404);
    expect(
      (await request(app()).get(`/api/chemicals/${chemical.id}`).set('Cookie', viewer)).body.sds,
    ).toBeNull();
  });

  it('when a chemical with an SDS is deleted, then its file goes too', async () => {
    const chemical = await make.chemical();
    const before = storedFiles().length;
    await uploadTo(`/api/chemicals/${chemical.id}/sds`, tinyPdf(), 'sds.pdf').expect(201);
    await request(app()).delete(`/api/chemicals/${chemical.id}`).set('Cookie', manager).expect(204);
    expect(storedFiles().length).toBe(before);
  });

  it('when an .exe is renamed to sds.pdf, then it is refused with 415 and nothing is kept', async () => {
    const chemical = await make.chemical();
    const before = storedFiles().length;
    const response = await uploadTo(
      `/api/chemicals/${chemical.id}/sds`,
      exeBytes(),
      'sds.pdf',
    ).expect(415);
    expect(response.body.error.code).toBe('unsupported_media_type');
    expect(response.body.error.message).toMatch(/must be a PDF file/);
    expect(response.body.error.message).toMatch(/read from the file itself/);
    expect(storedFiles().length).toBe(before);
    expect(incomingFiles()).toEqual([]);
  });

  it('when a PNG is sent as an SDS, then the message says only PDF is accepted', async () => {
    const chemical = await make.chemical();
    const response = await uploadTo(
      `/api/chemicals/${chemical.id}/sds`,
      tinyPng(),
      'scan.pdf',
    ).expect(415);
    expect(response.body.error.message).toMatch(/must be a PDF file; this one is PNG/);
  });

  it('when 50 MB are uploaded, then the answer is 413 naming the limit and nothing is kept', async () => {
    const chemical = await make.chemical();
    // Written to disk in 1 MB pieces and streamed from there, never held as one buffer.
    const dir = mkdtempSync(path.join(tmpdir(), 'lotwise-big-'));
    const big = path.join(dir, 'huge.pdf');
    const out = createWriteStream(big);
    const piece = Buffer.alloc(1024 * 1024, 0x20);
    piece.write('%PDF-1.4\n');
    for (let i = 0; i < 50; i++) {
      if (!out.write(piece)) await once(out, 'drain');
    }
    out.end();
    await once(out, 'finish');
    const before = storedFiles().length;
    try {
      const response = await uploadTo(`/api/chemicals/${chemical.id}/sds`, big, 'huge.pdf').expect(
        413,
      );
      expect(response.body.error).toMatchObject({ code: 'payload_too_large' });
      expect(response.body.error.message).toMatch(/upload limit of 20 MB/);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
    expect(storedFiles().length).toBe(before);
    expect(incomingFiles()).toEqual([]);
  });

  it('when the request is not multipart or holds no file, then the answer says how to send it', async () => {
    const chemical = await make.chemical();
    const json = await request(app())
      .post(`/api/chemicals/${chemical.id}/sds`)
      .set('Cookie', manager)
      .send({ file: 'x' })
      .expect(415);
    expect(json.body.error.message).toMatch(/multipart\/form-data, in the field "file"/);
    await request(app())
      .post(`/api/chemicals/${chemical.id}/sds`)
      .set('Cookie', manager)
      .field('note', 'no file here')
      .expect(400);
    await uploadTo(`/api/chemicals/${chemical.id}/sds`, tinyPdf(), 'x.pdf')
      .field('extra', '1')
      .expect(201);
    const wrongField = await request(app())
      .post(`/api/chemicals/${chemical.id}/sds`)
      .set('Cookie', manager)
      .attach('document', tinyPdf(), 'x.pdf')
      .expect(400);
    expect(wrongField.body.error.message).toMatch(/field "file"/);
  });

  it('when the chemical does not exist or the role may not write, then nothing is kept', async () => {
    const before = storedFiles().length;
    await uploadTo('/api/chemicals/987654/sds', tinyPdf(), 'x.pdf').expect(404);
    const chemical = await make.chemical();
    await uploadTo(`/api/chemicals/${chemical.id}/sds`, tinyPdf(), 'x.pdf', member).expect(403);
    expect(storedFiles().length).toBe(before);
    expect(incomingFiles()).toEqual([]);
  });
});

describe('certificates of analysis', () => {
  it('when a PNG scan is uploaded for a lot, then the lot names it and it downloads as uploaded', async () => {
    const lot = await make.lot((await make.chemical()).id);
    const png = tinyPng();
    const uploaded = await uploadTo(`/api/lots/${lot.id}/certificate`, png, 'CoA lot 7.png').expect(
      201,
    );
    const saved = lotSchema.parse(uploaded.body);
    expect(saved.certificateFileName).toBe('CoA lot 7.png');
    expect(saved.certificate).toMatchObject({ contentType: 'image/png', size: png.length });

    const response = await download(`/api/lots/${lot.id}/certificate`).expect(200);
    expect(response.headers['content-type']).toBe('image/png');
    expect(response.headers['content-disposition']).toMatch(/filename="CoA lot 7\.png"/);
    expect(Buffer.compare(response.body as Buffer, png)).toBe(0);

    await uploadTo(`/api/lots/${lot.id}/certificate`, tinyPdf(), 'CoA.pdf').expect(201);
    await uploadTo(`/api/lots/${lot.id}/certificate`, exeBytes(), 'CoA.pdf').expect(415);
    const still = await download(`/api/lots/${lot.id}/certificate`).expect(200);
    expect(still.headers['content-type']).toBe('application/pdf');

    await request(app())
      .delete(`/api/lots/${lot.id}/certificate`)
      .set('Cookie', manager)
      .expect(204);
    await download(`/api/lots/${lot.id}/certificate`).expect(404);
    const after = (await request(app()).get(`/api/lots/${lot.id}`).set('Cookie', viewer)).body;
    expect(after).toMatchObject({ certificateFileName: null, certificate: null });
  });

  it('when a PNG is uploaded under a .pdf name, then it is kept and downloads as .png', async () => {
    const lot = await make.lot((await make.chemical()).id);
    const uploaded = await uploadTo(
      `/api/lots/${lot.id}/certificate`,
      tinyPng(),
      'CoA lot 9.pdf',
    ).expect(201);
    expect(lotSchema.parse(uploaded.body).certificateFileName).toBe('CoA lot 9.png');
    const response = await download(`/api/lots/${lot.id}/certificate`).expect(200);
    expect(response.headers['content-type']).toBe('image/png');
    expect(response.headers['content-disposition']).toMatch(/filename="CoA lot 9\.png"/);
  });

  it('when a file was recorded under a name of another type, then the download still ends in its type', async () => {
    const lot = await make.lot((await make.chemical()).id);
    await uploadTo(`/api/lots/${lot.id}/certificate`, tinyPng(), 'scan.png').expect(201);
    await testContext().dataSource.query(
      "UPDATE lots SET certificate_file_name = 'old scan.pdf' WHERE id = ?",
      [lot.id],
    );
    const response = await download(`/api/lots/${lot.id}/certificate`).expect(200);
    expect(response.headers['content-disposition']).toMatch(/filename="old scan\.png"/);
  });

  it('when a JPEG is uploaded, then it is accepted; a viewer may download but not upload', async () => {
    const lot = await make.lot((await make.chemical()).id);
    const jpeg = jpegBytes();
    await uploadTo(`/api/lots/${lot.id}/certificate`, jpeg, 'coa.jpg', viewer).expect(403);
    await uploadTo(`/api/lots/${lot.id}/certificate`, jpeg, 'coa.jpg').expect(201);
    const response = await download(`/api/lots/${lot.id}/certificate`, viewer).expect(200);
    expect(response.headers['content-type']).toBe('image/jpeg');
  });
});
