import type { Readable } from "node:stream";
import {
  CopyObjectCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  HeadObjectCommand,
  NotFound,
  PutObjectCommand,
} from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { AppError } from "@/lib/errors";
import { createS3Client, type StorageConfig } from "./client";

export type Body = Buffer | Uint8Array | string | Readable;

/** A thin adapter around the S3 SDK: the only way the app reaches object storage. */
export function createStorage(config: StorageConfig) {
  const s3 = createS3Client(config);
  const Bucket = config.bucket;

  async function guard<T>(what: string, run: () => Promise<T>): Promise<T> {
    try {
      return await run();
    } catch (error) {
      if (error instanceof AppError) throw error;
      throw new AppError(
        "unavailable:storage",
        `File storage is not reachable (${what}). Try again shortly.`,
        {
          cause: error,
        },
      );
    }
  }

  return {
    bucket: Bucket,
    async ping(): Promise<void> {
      await guard("check", () => s3.send(new HeadBucketCommand({ Bucket })));
    },
    async put(key: string, body: Body, options: { contentType?: string; contentLength?: number } = {}) {
      await guard("upload", () =>
        s3.send(
          new PutObjectCommand({
            Bucket,
            Key: key,
            Body: body,
            ContentType: options.contentType,
            ContentLength: options.contentLength,
          }),
        ),
      );
    },
    /** The object's bytes, or null when there is no such object. */
    async get(key: string): Promise<Buffer | null> {
      return guard("download", async () => {
        try {
          const out = await s3.send(new GetObjectCommand({ Bucket, Key: key }));
          if (!out.Body) return null;
          return Buffer.from(await out.Body.transformToByteArray());
        } catch (error) {
          if (isMissing(error)) return null;
          throw error;
        }
      });
    },
    /** The object as a Node stream, or null when there is no such object. */
    async stream(key: string): Promise<Readable | null> {
      return guard("download", async () => {
        try {
          const out = await s3.send(new GetObjectCommand({ Bucket, Key: key }));
          return (out.Body as Readable | undefined) ?? null;
        } catch (error) {
          if (isMissing(error)) return null;
          throw error;
        }
      });
    },
    async head(key: string): Promise<{ size: number; contentType?: string } | null> {
      return guard("look-up", async () => {
        try {
          const out = await s3.send(new HeadObjectCommand({ Bucket, Key: key }));
          return { size: out.ContentLength ?? 0, contentType: out.ContentType };
        } catch (error) {
          if (isMissing(error)) return null;
          throw error;
        }
      });
    },
    /** Copies an object inside the bucket (server-side; the bytes do not pass through the app). */
    async copy(fromKey: string, toKey: string): Promise<void> {
      await guard("copy", () =>
        s3.send(
          new CopyObjectCommand({
            Bucket,
            Key: toKey,
            CopySource: `${Bucket}/${fromKey.split("/").map(encodeURIComponent).join("/")}`,
          }),
        ),
      );
    },
    async remove(key: string): Promise<void> {
      await guard("delete", () => s3.send(new DeleteObjectCommand({ Bucket, Key: key })));
    },
    /**
     * A URL the browser can PUT the file to directly, valid for `expiresIn` seconds. The size and type are signed
     * into it: the store refuses a body of any other length.
     */
    async presignPut(
      key: string,
      options: { contentType?: string; contentLength?: number; expiresIn?: number } = {},
    ): Promise<string> {
      const signed = ["host", ...(options.contentType ? ["content-type"] : [])];
      if (options.contentLength !== undefined) signed.push("content-length");
      return guard("presign", () =>
        getSignedUrl(
          s3,
          new PutObjectCommand({
            Bucket,
            Key: key,
            ContentType: options.contentType,
            ContentLength: options.contentLength,
          }),
          { expiresIn: options.expiresIn ?? 600, signableHeaders: new Set(signed) },
        ),
      );
    },
    async presignGet(key: string, options: { fileName?: string; expiresIn?: number } = {}): Promise<string> {
      return guard("presign", () =>
        getSignedUrl(
          s3,
          new GetObjectCommand({
            Bucket,
            Key: key,
            ResponseContentDisposition: options.fileName
              ? `attachment; filename="${options.fileName.replace(/["\\\r\n]/g, "_")}"`
              : undefined,
          }),
          { expiresIn: options.expiresIn ?? 300 },
        ),
      );
    },
  };
}

export type Storage = ReturnType<typeof createStorage>;

function isMissing(error: unknown): boolean {
  if (error instanceof NotFound) return true;
  const e = error as { name?: string; $metadata?: { httpStatusCode?: number } };
  return e?.name === "NoSuchKey" || e?.name === "NotFound" || e?.$metadata?.httpStatusCode === 404;
}
