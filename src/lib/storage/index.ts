import "server-only";
import { env } from "@/lib/env";
import { createStorage, type Storage } from "./storage";

export type { Storage } from "./storage";

let instance: Storage | undefined;

/** The app's object storage, configured from the environment. */
export function storage(): Storage {
  const e = env();
  instance ??= createStorage({
    endpoint: e.S3_ENDPOINT,
    region: e.S3_REGION,
    bucket: e.S3_BUCKET,
    accessKeyId: e.S3_ACCESS_KEY_ID,
    secretAccessKey: e.S3_SECRET_ACCESS_KEY,
  });
  return instance;
}
