// S3-compatible object storage through the AWS SDK v3 (STORAGE_DRIVER=s3).
import { createReadStream } from 'node:fs';
import { stat } from 'node:fs/promises';
import type { Readable } from 'node:stream';
import { GetObjectCommand, HeadObjectCommand, PutObjectCommand, S3Client, S3ServiceException } from '@aws-sdk/client-s3';
import type { EvidenceStorage } from './storage';

export interface S3StorageOptions {
  bucket: string;
  region: string;
  endpoint?: string;
  accessKeyId?: string;
  secretAccessKey?: string;
}

const isMissing = (error: unknown) =>
  error instanceof S3ServiceException && (error.$metadata?.httpStatusCode === 404 || error.name === 'NoSuchKey' || error.name === 'NotFound');

export function createS3Storage(options: S3StorageOptions): EvidenceStorage {
  const client = new S3Client({
    region: options.region,
    endpoint: options.endpoint,
    // Path-style addressing works with every S3-compatible server (bucket in the path, not the host name).
    forcePathStyle: Boolean(options.endpoint),
    // Checksums only where S3 requires them: the SDK's default streams bodies as
    // aws-chunked with trailing checksums, which not every S3-compatible server decodes.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    credentials:
      options.accessKeyId && options.secretAccessKey
        ? { accessKeyId: options.accessKeyId, secretAccessKey: options.secretAccessKey }
        : undefined,
  });
  const exists = async (key: string) => {
    try {
      await client.send(new HeadObjectCommand({ Bucket: options.bucket, Key: key }));
      return true;
    } catch (error) {
      if (isMissing(error)) return false;
      throw error;
    }
  };
  return {
    name: 's3',
    exists,
    async putFile(key, filePath, mediaType) {
      if (await exists(key)) return;
      const { size } = await stat(filePath);
      await client.send(
        new PutObjectCommand({
          Bucket: options.bucket,
          Key: key,
          Body: createReadStream(filePath),
          ContentLength: size,
          ContentType: mediaType,
        }),
      );
    },
    async read(key) {
      try {
        const response = await client.send(new GetObjectCommand({ Bucket: options.bucket, Key: key }));
        return (response.Body as Readable | undefined) ?? null;
      } catch (error) {
        if (isMissing(error)) return null;
        throw error;
      }
    },
  };
}
