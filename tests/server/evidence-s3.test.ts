// The S3 driver against a real S3-compatible server on loopback (s3rver),
// started by this file: no mock of the SDK.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import S3rver from 's3rver';
import PDFDocument from 'pdfkit';
import { createS3Storage } from '../../server/storage/s3-storage';
import { contentKey } from '../../server/storage';
import { createTestContext, makeUser, signIn, type TestContext } from '../helpers/test-app';
import { makeActionRow } from '../helpers/evidence-owners';

const ROOT = path.resolve(import.meta.dirname, '../..');
const dir = path.join(ROOT, '.data', `test-s3-${process.pid}-${Date.now()}`);
const BUCKET = 'whorl-evidence-test';
let server: S3rver;
let endpoint: string;
let context: TestContext;

beforeAll(async () => {
  mkdirSync(dir, { recursive: true });
  server = new S3rver({ port: 0, address: '127.0.0.1', silent: true, directory: path.join(dir, 's3'), configureBuckets: [{ name: BUCKET }] });
  const address = await server.run();
  endpoint = `http://127.0.0.1:${address.port}`;
  context = createTestContext({
    STORAGE_DRIVER: 's3',
    STORAGE_DIR: path.join(dir, 'local'),
    S3_ENDPOINT: endpoint,
    S3_BUCKET: BUCKET,
    S3_ACCESS_KEY_ID: 'S3RVER',
    S3_SECRET_ACCESS_KEY: 'S3RVER',
  });
});
afterAll(async () => {
  await context?.close();
  await server?.close();
  rmSync(dir, { recursive: true, force: true });
});

const sha256 = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');

async function collect(stream: NodeJS.ReadableStream): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks);
}

describe('S3-compatible evidence storage', () => {
  it('when a file is put, then it reads back identical, a second put of the same key changes nothing, and a missing key reads as null', async () => {
    const storage = createS3Storage({ bucket: BUCKET, region: 'us-east-1', endpoint, accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' });
    const bytes = Buffer.from('channel,phase_deg\n1,42.5\n');
    const file = path.join(dir, 'probe.csv');
    writeFileSync(file, bytes);
    const key = contentKey(sha256(bytes));
    expect(await storage.exists(key)).toBe(false);
    await storage.putFile(key, file, 'text/csv');
    await storage.putFile(key, file, 'text/csv');
    expect(await storage.exists(key)).toBe(true);
    expect((await collect((await storage.read(key))!)).equals(bytes)).toBe(true);
    expect(await storage.read(contentKey('0'.repeat(64)))).toBeNull();
  });

  it('when STORAGE_DRIVER=s3, then an upload through the API lands in the bucket and downloads byte-identical', async () => {
    const quality = await makeUser({ roles: ['quality_manager'] });
    const technician = await makeUser({ roles: ['technician'] });
    const action = await makeActionRow(context.deps.sequelize, { ownerId: technician.id, createdById: quality.id });
    const session = await signIn(context.app, technician);
    const pdf = await new Promise<Buffer>((resolve) => {
      const doc = new PDFDocument();
      const chunks: Buffer[] = [];
      doc.on('data', (chunk: Buffer) => chunks.push(chunk));
      doc.on('end', () => resolve(Buffer.concat(chunks)));
      doc.text('Bobbin coil calibration on the reference tube');
      doc.end();
    });
    const upload = await session.post('/api/evidence').field('recordType', 'action').field('recordId', String(action.id)).attach('file', pdf, { filename: 'tube.pdf' });
    expect(upload.status).toBe(201);
    const storage = createS3Storage({ bucket: BUCKET, region: 'us-east-1', endpoint, accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' });
    expect(await storage.exists(contentKey(sha256(pdf)))).toBe(true);
    const download = await session.agent.get(`/api/evidence/${upload.body.items[0].id}/download`).buffer(true).parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });
    expect(download.status).toBe(200);
    expect((download.body as Buffer).equals(pdf)).toBe(true);
  });
});
