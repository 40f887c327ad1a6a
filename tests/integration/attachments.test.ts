import crypto from 'node:crypto';

import sharp from 'sharp';
import { beforeAll, describe, expect, it, vi } from 'vitest';

import * as attachmentsRoute from '@/app/api/boards/[boardId]/attachments/route';
import * as photoRoute from '@/app/api/attachments/[attachmentId]/route';
import * as thumbRoute from '@/app/api/attachments/[attachmentId]/thumb/route';
import { s3 } from '@/lib/storage/s3';
import { Attachment, Way } from '@/models';

import { noAnswer } from '../stubs/storage-away';

import { ctx, jsonRequest, makeBoard, makeOrganisation, signInAs } from './helpers';

type Org = Awaited<ReturnType<typeof makeOrganisation>>;
let team: Org;
let other: Org;
let boardId: string;
let png: Buffer;

beforeAll(async () => {
  team = await makeOrganisation('Photos');
  other = await makeOrganisation('Nosy');
  boardId = (await makeBoard(team.org.id, 'flat')).board.id;
  png = await sharp({ create: { width: 800, height: 600, channels: 3, background: '#b5652b' } })
    .png()
    .toBuffer();
});

function upload(bytes: Uint8Array, name: string, type: string, fields: Record<string, string> = {}) {
  const form = new FormData();
  form.append('file', new File([new Uint8Array(bytes)], name, { type }));
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  const req = new Request(`http://127.0.0.1/api/boards/${boardId}/attachments`, { method: 'POST', body: form });
  return attachmentsRoute.POST(req, ctx({ boardId }));
}

const fetchPhoto = (route: typeof photoRoute | typeof thumbRoute, attachmentId: string) =>
  route.GET(jsonRequest('GET'), ctx({ attachmentId }));

describe('photos', () => {
  it('an image is stored with a thumbnail and read back byte for byte by a member', async () => {
    signInAs(team.users.installer);
    const way = await Way.findOne({ where: { boardId, position: 2 } });
    const res = await upload(png, 'board-front.png', 'image/png', { wayId: way!.id });
    expect(res.status).toBe(201);
    const { attachment } = await res.json();
    expect(attachment).toMatchObject({ wayId: way!.id, contentType: 'image/png', sizeBytes: png.length });

    signInAs(team.users.designer);
    const original = await fetchPhoto(photoRoute, attachment.id);
    expect(original.status).toBe(200);
    expect(original.headers.get('content-type')).toBe('image/png');
    expect(Buffer.from(await original.arrayBuffer()).equals(png)).toBe(true);
    const thumb = await fetchPhoto(thumbRoute, attachment.id);
    expect(thumb.headers.get('content-type')).toBe('image/jpeg');
    const meta = await sharp(Buffer.from(await thumb.arrayBuffer())).metadata();
    expect(meta.format).toBe('jpeg');
    expect(Math.max(meta.width!, meta.height!)).toBe(320);

    const { attachments } = await (await attachmentsRoute.GET(jsonRequest('GET'), ctx({ boardId }))).json();
    expect(attachments.map((a: { id: string }) => a.id)).toContain(attachment.id);
  });

  it('an 11 MB image is refused with 413 naming the file field', async () => {
    signInAs(team.users.installer);
    // Random pixels barely compress: 2000 × 1950 × 3 bytes ≈ 11.2 MiB of PNG
    const noise = crypto.randomBytes(2000 * 1950 * 3);
    const big = await sharp(noise, { raw: { width: 2000, height: 1950, channels: 3 } })
      .png({ compressionLevel: 0 })
      .toBuffer();
    expect(big.length).toBeGreaterThan(11 * 1024 * 1024);
    const res = await upload(big, 'huge.png', 'image/png');
    expect(res.status).toBe(413);
    const body = await res.json();
    expect(body.issues[0].path).toBe('file');
    expect(body.error).toMatch(/at most 10 MB/);
  });

  it('a text file renamed .jpg is refused with 415, whatever its name and declared type', async () => {
    signInAs(team.users.installer);
    const res = await upload(Buffer.from('Way 3: kitchen sockets\n'.repeat(50)), 'photo.jpg', 'image/jpeg');
    expect(res.status).toBe(415);
    const body = await res.json();
    expect(body.issues[0].path).toBe('file');
    expect(body.error).toMatch(/not a photo/);
    // A PDF is a known type but not an image
    const pdf = await upload(
      Buffer.from('%PDF-1.4\n%âãÏÓ\n1 0 obj<<>>endobj\ntrailer<<>>\n%%EOF\n'),
      'x.jpg',
      'image/jpeg',
    );
    expect(pdf.status).toBe(415);
  });

  it('refuses a missing file, a way of another board and a role that does not walk boards', async () => {
    signInAs(team.users.installer);
    const form = new FormData();
    form.append('note', 'no file');
    const noFile = await attachmentsRoute.POST(
      new Request('http://127.0.0.1/x', { method: 'POST', body: form }),
      ctx({ boardId }),
    );
    expect(noFile.status).toBe(400);
    expect((await noFile.json()).issues[0].path).toBe('file');
    const elsewhere = await makeBoard(team.org.id, 'flat');
    const strayWay = await Way.findOne({ where: { boardId: elsewhere.board.id, position: 2 } });
    const stray = await upload(png, 'x.png', 'image/png', { wayId: strayWay!.id });
    expect(stray.status).toBe(400);
    expect((await stray.json()).issues[0].path).toBe('wayId');
    signInAs(team.users.designer);
    expect((await upload(png, 'x.png', 'image/png')).status).toBe(403);
  });

  it('another organisation cannot fetch or delete a photo, and a deleted photo is gone', async () => {
    signInAs(team.users.inspector);
    const { attachment } = await (await upload(png, 'evidence.png', 'image/png')).json();
    signInAs(other.users.admin);
    expect((await fetchPhoto(photoRoute, attachment.id)).status).toBe(404);
    expect((await fetchPhoto(thumbRoute, attachment.id)).status).toBe(404);
    expect((await photoRoute.DELETE(jsonRequest('DELETE'), ctx({ attachmentId: attachment.id }))).status).toBe(404);
    expect((await attachmentsRoute.GET(jsonRequest('GET'), ctx({ boardId }))).status).toBe(404);
    signInAs(null);
    expect((await fetchPhoto(photoRoute, attachment.id)).status).toBe(401);
    signInAs(team.users.inspector);
    const removed = await photoRoute.DELETE(jsonRequest('DELETE'), ctx({ attachmentId: attachment.id }));
    expect(removed.status).toBe(200);
    expect(await removed.json()).toEqual({ effect: 'deleted' });
    expect((await fetchPhoto(photoRoute, attachment.id)).status).toBe(404);
  });

  it('while the file storage is away, an upload is refused with 503 saying so and records nothing', async () => {
    signInAs(team.users.installer);
    const kept = await upload(png, 'board-before.png', 'image/png');
    expect(kept.status).toBe(201);
    const { attachment } = await kept.json();
    const rows = await Attachment.count({ where: { boardId } });
    const send = vi.spyOn(s3(), 'send').mockRejectedValue((await noAnswer()) as never);
    try {
      const res = await upload(png, 'board-during.png', 'image/png');
      expect(res.status).toBe(503);
      expect(res.headers.get('retry-after')).toBe('5');
      expect((await res.json()).error).toBe(
        'File storage is not reachable just now. Nothing was changed; try again shortly.',
      );
      expect(await Attachment.count({ where: { boardId } })).toBe(rows);
      // A stored photo cannot be read meanwhile: 503 too, not an error of ours
      expect((await fetchPhoto(photoRoute, attachment.id)).status).toBe(503);
    } finally {
      send.mockRestore();
    }
    expect((await fetchPhoto(photoRoute, attachment.id)).status).toBe(200);
  });
});
