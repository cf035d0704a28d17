// Reading PDFs the server sends: the raw bytes through Supertest, and the text
// as poppler's pdftotext reads it.
import type request from 'supertest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

/** A Supertest parser that keeps the body as bytes. */
export const binary = (res: request.Response, done: (error: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (chunk: Buffer) => chunks.push(chunk));
  res.on('end', () => done(null, Buffer.concat(chunks)));
};

/** The PDF's text as poppler's pdftotext reads it, one string per page. */
export function pdfPages(pdf: Buffer): string[] {
  const dir = mkdtempSync(path.join(tmpdir(), 'whorl-pdf-'));
  const file = path.join(dir, 'report.pdf');
  writeFileSync(file, pdf);
  const result = spawnSync('pdftotext', ['-enc', 'UTF-8', '-layout', file, '-'], { encoding: 'utf8' });
  if (result.status !== 0) throw new Error(`pdftotext failed: ${result.stderr}`);
  return result.stdout.split('\f').filter((page) => page.trim().length > 0);
}
