import { createHash } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { sanitiseFileName } from '../../server/files/file-names';
import { demoPdf, DEMO_PHOTO } from '../../seeds/data/demo-sites';
import { useSiteWorld, type SiteWorld } from '../setup/site-fixtures';

const { harness, db, world: currentWorld } = await useSiteWorld();
let world: SiteWorld;
beforeAll(() => {
  world = currentWorld();
});

const filesOf = (siteId: string) => `/api/sites/${siteId}/files`;
const sha256 = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');
// A JPEG's opening bytes (SOI marker FFD8, then an APP0 "JFIF" segment) are what content
// sniffing reads; the PNG and PDF are the demo seed's real, complete files.
const JPEG = Buffer.concat([
  Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10]),
  Buffer.from('JFIF\0'),
  Buffer.alloc(64),
]);

describe('uploading and downloading site files', () => {
  it('stores a photo, records its SHA-256, and streams the same bytes back', async () => {
    const { agent, csrfToken } = await harness.signedInAs(world.engineer.userId);
    const uploaded = await agent
      .post(filesOf(world.own.siteId))
      .set('x-csrf-token', csrfToken)
      .field('description', 'Panel as fitted')
      .attach('file', DEMO_PHOTO, { filename: 'panel.png', contentType: 'image/png' });
    expect(uploaded.status).toBe(201);
    expect(uploaded.body).toMatchObject({
      fileName: 'panel.png',
      contentType: 'image/png',
      sizeBytes: DEMO_PHOTO.length,
      sha256: sha256(DEMO_PHOTO),
      description: 'Panel as fitted',
      uploadedBy: world.engineer.displayName,
    });
    const downloaded = await agent
      .get(`${filesOf(world.own.siteId)}/${uploaded.body.id}/content`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(downloaded.status).toBe(200);
    expect(downloaded.headers['content-type']).toBe('image/png');
    expect(downloaded.headers['content-disposition']).toMatch(
      /^attachment; filename="?panel\.png"?$/,
    );
    expect(downloaded.headers['x-content-type-options']).toBe('nosniff');
    expect(sha256(downloaded.body as Buffer)).toBe(sha256(DEMO_PHOTO));
    const inline = await agent.get(
      `${filesOf(world.own.siteId)}/${uploaded.body.id}/content?inline=1`,
    );
    expect(inline.headers['content-disposition']).toBe('inline');
  });

  it('decides the type from the bytes: a PDF named .png is stored as a PDF, a JPEG is accepted', async () => {
    const { agent, csrfToken } = await harness.signedInAs(world.office.userId);
    const pdf = await agent
      .post(filesOf(world.own.siteId))
      .set('x-csrf-token', csrfToken)
      .attach('file', demoPdf('Certificate'), {
        filename: 'looks-like-a-photo.png',
        contentType: 'image/png',
      });
    expect(pdf.status).toBe(201);
    expect(pdf.body).toMatchObject({
      contentType: 'application/pdf',
      fileName: 'looks-like-a-photo.pdf',
    });
    const jpeg = await agent
      .post(filesOf(world.own.siteId))
      .set('x-csrf-token', csrfToken)
      .attach('file', JPEG, 'photo.jpeg');
    expect(jpeg.body.contentType).toBe('image/jpeg');
  });

  it('refuses a mislabelled file that is none of the allowed types, saving nothing', async () => {
    const { agent, csrfToken } = await harness.signedInAs(world.office.userId);
    const before = await db('site_files').count('* as n').first();
    for (const [bytes, name] of [
      [Buffer.from('#!/bin/sh\necho not a photo\n'), 'holiday.jpg'],
      [
        Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'),
        'logo.png',
      ],
      [Buffer.from('PK\u0003\u0004 zip archive'), 'plans.pdf'],
    ] as const) {
      const response = await agent
        .post(filesOf(world.own.siteId))
        .set('x-csrf-token', csrfToken)
        .attach('file', bytes, name);
      expect(response.status, name).toBe(415);
      expect(response.body).toMatchObject({
        type: '/problems/unsupported-type',
        errors: [{ path: 'body.file' }],
      });
    }
    expect(await db('site_files').count('* as n').first()).toEqual(before);
  });

  it('refuses a file over 15 MiB with 413, and a request with no file with 400', async () => {
    const { agent, csrfToken } = await harness.signedInAs(world.office.userId);
    const huge = Buffer.concat([DEMO_PHOTO, Buffer.alloc(15 * 1024 * 1024 + 1)]);
    const tooBig = await agent
      .post(filesOf(world.own.siteId))
      .set('x-csrf-token', csrfToken)
      .attach('file', huge, 'big.png');
    expect(tooBig.status).toBe(413);
    expect(tooBig.body.type).toBe('/problems/too-large');
    const none = await agent
      .post(filesOf(world.own.siteId))
      .set('x-csrf-token', csrfToken)
      .field('description', 'no file');
    expect(none.status).toBe(400);
    expect(none.body.errors[0].path).toBe('body.file');
  });

  it('never lets a file name reach the disk, and cleans names for download', async () => {
    const { agent, csrfToken } = await harness.signedInAs(world.office.userId);
    const response = await agent
      .post(filesOf(world.own.siteId))
      .set('x-csrf-token', csrfToken)
      .attach('file', DEMO_PHOTO, '../../../etc/passwd.png');
    expect(response.status).toBe(201);
    expect(response.body.fileName).toBe('passwd.png');
    const row = await db('site_files').where({ id: response.body.id }).first();
    expect(row.storage_key).toBe(`sites/${world.own.siteId}/${response.body.id}`);
  });

  it('lets a homeowner remove only what they uploaded', async () => {
    const homeowner = await harness.signedInAs(world.homeowner.userId);
    const theirs = await homeowner.agent
      .post(filesOf(world.own.siteId))
      .set('x-csrf-token', homeowner.csrfToken)
      .attach('file', DEMO_PHOTO, 'my-photo.png');
    const engineers = (await homeowner.agent.get(filesOf(world.own.siteId))).body.files.find(
      (file: { uploadedBy: string }) => file.uploadedBy === world.engineer.displayName,
    );
    expect(
      (
        await homeowner.agent
          .delete(`${filesOf(world.own.siteId)}/${engineers.id}`)
          .set('x-csrf-token', homeowner.csrfToken)
      ).status,
    ).toBe(403);
    expect(
      (
        await homeowner.agent
          .delete(`${filesOf(world.own.siteId)}/${theirs.body.id}`)
          .set('x-csrf-token', homeowner.csrfToken)
      ).status,
    ).toBe(204);
    expect(
      await harness.storage.open(`sites/${world.own.siteId}/${theirs.body.id}`),
    ).toBeUndefined();
  });

  it("streams nothing from another site's files, even with a real file id", async () => {
    const other = await harness.signedInAs(world.otherHomeowner.userId);
    const { agent } = await harness.signedInAs(world.engineer.userId);
    const [file] = (await agent.get(filesOf(world.own.siteId))).body.files;
    expect((await other.agent.get(`${filesOf(world.own.siteId)}/${file.id}/content`)).status).toBe(
      404,
    );
    expect(
      (await other.agent.get(`${filesOf(world.other.siteId)}/${file.id}/content`)).status,
    ).toBe(404);
  });
});

describe('sanitiseFileName', () => {
  it.each([
    ['..\\..\\windows\\system32\\evil.jpg', 'image/jpeg', 'evil.jpg'],
    ['.hidden.png', 'image/png', 'hidden.png'],
    ['report<1>:"final"?.pdf', 'application/pdf', 'report_1___final__.pdf'],
    ['no-extension', 'image/webp', 'no-extension.webp'],
    ['\u202Egnp.exe', 'image/png', 'gnp.png'],
    ['', 'application/pdf', 'file.pdf'],
  ])('%s as %s → %s', (name, type, expected) => {
    expect(sanitiseFileName(name, type)).toBe(expected);
  });
});
